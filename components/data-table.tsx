"use client";
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { usePathname, useSearchParams } from "next/navigation";

// A table whose rows, order and paging come from the server (the URL carries page and search).
export function DataTable<T>({
  columns,
  data,
  total,
  page,
  pageSize,
  caption,
  testId,
}: {
  columns: ColumnDef<T, unknown>[];
  data: T[];
  total: number;
  page: number;
  pageSize: number;
  caption: string;
  testId?: string;
}) {
  // eslint-disable-next-line react-hooks/incompatible-library -- the app does not use the React Compiler
  const table = useReactTable({ data, columns, getCoreRowModel: getCoreRowModel(), manualPagination: true, manualSorting: true, rowCount: total });
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const path = usePathname();
  const params = useSearchParams();
  const hrefFor = (p: number) => {
    const next = new URLSearchParams(params.toString());
    next.set("page", String(p));
    return `${path}?${next.toString()}`;
  };
  return (
    <div className="card overflow-x-auto" data-testid={testId}>
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-graphite-100">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => (
                <th key={h.id} scope="col" className="px-3 py-2 text-sm font-semibold text-graphite-900">
                  {h.isPlaceholder ? null : flexRender(h.column.columnDef.header, h.getContext())}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.length === 0 ? (
            <tr>
              <td colSpan={columns.length} className="px-3 py-6 text-center text-graphite-600">Nothing matches.</td>
            </tr>
          ) : (
            table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-graphite-100 align-top">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </table>
      <nav aria-label="Pages" className="flex items-center justify-between gap-2 border-t border-graphite-100 px-3 py-2 text-sm">
        <span className="figures">{total === 0 ? "0 rows" : `${(page - 1) * pageSize + 1}–${Math.min(total, page * pageSize)} of ${total}`}</span>
        <span className="flex gap-2">
          {page > 1 ? <Link className="btn btn-quiet" href={hrefFor(page - 1)}>← Previous</Link> : null}
          <span className="figures self-center">Page {page} of {pages}</span>
          {page < pages ? <Link className="btn btn-quiet" href={hrefFor(page + 1)}>Next →</Link> : null}
        </span>
      </nav>
    </div>
  );
}
