"use client";
// The jobs list: rows, order and paging come from the server (the URL carries q, filters, sort and page);
// TanStack Table lays out the columns and the sortable headers.
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { usePathname, useSearchParams } from "next/navigation";
import { StatusBadge } from "@/components/status-badge";
import { JOB_STATE_LABELS } from "@/lib/jobs/labels";
import type { JobListRow } from "@/lib/jobs/record";
import { DUE_CUE_LABELS, dueCue } from "@/lib/jobs/due";

type SortKey = "number" | "due" | "customer" | "status" | "progress" | "updated";

function useHref() {
  const path = usePathname();
  const params = useSearchParams();
  return (changes: Record<string, string | null>) => {
    const next = new URLSearchParams(params.toString());
    for (const [k, v] of Object.entries(changes)) {
      if (v === null) next.delete(k);
      else next.set(k, v);
    }
    return `${path}?${next.toString()}`;
  };
}

function SortHeader({ label, sortKey, sort, dir }: { label: string; sortKey: SortKey; sort: SortKey; dir: "asc" | "desc" }) {
  const href = useHref();
  const active = sort === sortKey;
  const nextDir = active && dir === "asc" ? "desc" : active ? "asc" : sortKey === "number" || sortKey === "updated" ? "desc" : "asc";
  return (
    <Link href={href({ sort: sortKey, dir: nextDir, page: null })} className="inline-flex min-h-11 items-center gap-1 font-semibold underline-offset-2 hover:underline" aria-label={`Sort by ${label.toLowerCase()}${active ? (dir === "asc" ? ", now ascending" : ", now descending") : ""}`}>
      {label}
      <span aria-hidden="true">{active ? (dir === "asc" ? "▲" : "▼") : "↕"}</span>
    </Link>
  );
}

export function JobsTable({ rows, total, page, pageSize, sort, dir, today }: { rows: JobListRow[]; total: number; page: number; pageSize: number; sort: SortKey; dir: "asc" | "desc"; today: string }) {
  const href = useHref();
  const columns: ColumnDef<JobListRow, unknown>[] = [
    {
      id: "number",
      header: () => <SortHeader label="Job" sortKey="number" sort={sort} dir={dir} />,
      cell: ({ row }) => (
        <div>
          <Link href={`/jobs/${row.original.id}`} className="figures whitespace-nowrap font-bold text-graphite-950 underline" data-testid="job-link">{row.original.number}</Link>
          <div className="mt-1"><StatusBadge tone={JOB_STATE_LABELS[row.original.status].tone}>{JOB_STATE_LABELS[row.original.status].label}</StatusBadge></div>
        </div>
      ),
    },
    {
      id: "customer",
      header: () => <SortHeader label="Customer" sortKey="customer" sort={sort} dir={dir} />,
      cell: ({ row }) => <span className="font-semibold">{row.original.customerName}</span>,
    },
    {
      id: "vehicle",
      header: "Vehicle · VIN",
      cell: ({ row }) => (
        <div>
          <div>{row.original.vehicle}</div>
          <div className="figures text-sm text-graphite-700">
            {row.original.vin || "no VIN"}
            {row.original.vinWarning ? <span className="ml-1 font-semibold text-verdict-warn" title="The VIN's check digit or form did not check out">▲ check</span> : null}
          </div>
        </div>
      ),
    },
    { id: "axle", header: "Axle tag", cell: ({ row }) => <span className="figures whitespace-nowrap">{row.original.axleTag}</span> },
    {
      id: "procedure",
      header: "Procedure · welders",
      cell: ({ row }) => (
        <div className="text-sm">
          <div>{row.original.procedure}</div>
          <div className="text-graphite-700">{row.original.welders.join(", ") || "no welder yet"}</div>
        </div>
      ),
    },
    {
      id: "due",
      header: () => <SortHeader label="Due" sortKey="due" sort={sort} dir={dir} />,
      cell: ({ row }) => {
        const { dueDate, status } = row.original;
        const cue = dueCue(dueDate, today, status);
        return (
          <span className="figures whitespace-nowrap">
            {dueDate ?? "—"}
            {cue ? <span className={`block font-sans text-sm font-semibold ${cue === "overdue" ? "text-verdict-warn" : ""}`} data-testid="due-cue">{DUE_CUE_LABELS[cue]}</span> : null}
          </span>
        );
      },
    },
    {
      id: "progress",
      header: () => <SortHeader label="Progress" sortKey="progress" sort={sort} dir={dir} />,
      cell: ({ row }) => {
        const { stepsSigned: s, stepsTotal: t, openNonconformances: nc } = row.original;
        return (
          <div className="min-w-28">
            <div className="h-2 overflow-hidden rounded bg-graphite-200" aria-hidden="true"><div className="h-full bg-graphite-800" style={{ width: `${t ? (s / t) * 100 : 0}%` }} /></div>
            <div className="figures mt-1 text-sm">{s}/{t} signed</div>
            {nc ? <div className="text-sm font-semibold text-verdict-fail">✕ {nc} open NC</div> : null}
          </div>
        );
      },
    },
  ];
  // eslint-disable-next-line react-hooks/incompatible-library -- the app does not use the React Compiler
  const table = useReactTable({ data: rows, columns, getCoreRowModel: getCoreRowModel(), manualPagination: true, manualSorting: true, rowCount: total });
  const pages = Math.max(1, Math.ceil(total / pageSize));
  return (
    <div className="card overflow-x-auto" data-testid="jobs-table">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Jobs of this shop</caption>
        <thead className="bg-graphite-100">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => (
                <th key={h.id} scope="col" className="px-3 py-1 text-sm text-graphite-900" aria-sort={h.column.id === sort ? (dir === "asc" ? "ascending" : "descending") : undefined}>
                  {h.isPlaceholder ? null : flexRender(h.column.columnDef.header, h.getContext())}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.length === 0 ? (
            <tr><td colSpan={columns.length} className="px-3 py-6 text-center text-graphite-700">No jobs match.</td></tr>
          ) : (
            table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-graphite-100 align-top" data-testid="job-row">
                {row.getVisibleCells().map((cell) => <td key={cell.id} className="px-3 py-2">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>)}
              </tr>
            ))
          )}
        </tbody>
      </table>
      <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-2 border-t border-graphite-100 px-3 py-2 text-sm">
        <span className="figures" data-testid="jobs-count">{total === 0 ? "0 jobs" : `${(page - 1) * pageSize + 1}–${Math.min(total, page * pageSize)} of ${total}`}</span>
        <span className="flex gap-2">
          {page > 1 ? <Link className="btn btn-quiet" href={href({ page: String(page - 1) })}>← Previous</Link> : null}
          <span className="figures self-center">Page {page} of {pages}</span>
          {page < pages ? <Link className="btn btn-quiet" href={href({ page: String(page + 1) })}>Next →</Link> : null}
        </span>
      </nav>
    </div>
  );
}
