"use client";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { usePathname, useSearchParams } from "next/navigation";
import { DataTable } from "@/components/data-table";
import type { VersionStatus } from "@/lib/procedures/labels";
import { VersionStatusBadge } from "./status";

type ProcedureRowView = {
  id: string;
  title: string;
  code: string;
  ownerName: string | null;
  changedAt: string;
  versions: { number: number; status: VersionStatus }[];
};

// Sorting happens on the server: a header is a link that flips the order in the URL.
function SortHeader({ field, label }: { field: "title" | "updated"; label: string }) {
  const path = usePathname();
  const params = useSearchParams();
  const current = (params.get("sort") ?? "title") === field;
  const dir = params.get("dir") === "desc" ? "desc" : "asc";
  const next = new URLSearchParams(params.toString());
  next.set("sort", field);
  next.set("dir", current && dir === "asc" ? "desc" : "asc");
  next.delete("page");
  return (
    <Link
      href={`${path}?${next.toString()}`}
      className="inline-flex min-h-11 items-center gap-1 whitespace-nowrap underline-offset-2 hover:underline"
      aria-label={`Sort by ${label.toLowerCase()}${current ? `, now ${dir === "asc" ? "ascending" : "descending"}` : ""}`}
    >
      {label}
      <span aria-hidden="true" className="figures text-xs">{current ? (dir === "asc" ? "▲" : "▼") : "↕"}</span>
    </Link>
  );
}

const columns: ColumnDef<ProcedureRowView, unknown>[] = [
  {
    id: "title",
    header: () => <SortHeader field="title" label="Procedure" />,
    cell: ({ row }) => (
      <div className="max-w-xl">
        <Link href={`/procedures/${row.original.id}`} className="font-semibold text-graphite-950 underline-offset-2 hover:underline">
          {row.original.title}
        </Link>
        {row.original.code ? <div className="mt-0.5 text-sm text-graphite-600">{row.original.code}</div> : null}
      </div>
    ),
  },
  {
    id: "versions",
    header: "Versions",
    cell: ({ row }) => (
      <ul className="flex flex-wrap gap-1" aria-label={`Versions of ${row.original.title}`}>
        {row.original.versions.map((v) => (
          <li key={v.number}>
            <Link href={`/procedures/${row.original.id}/versions/${v.number}`} className="hover:opacity-80">
              <VersionStatusBadge status={v.status} number={v.number} />
            </Link>
          </li>
        ))}
      </ul>
    ),
  },
  { id: "owner", header: "Owner", cell: ({ row }) => <span className="text-sm">{row.original.ownerName ?? "—"}</span> },
  {
    id: "updated",
    header: () => <SortHeader field="updated" label="Last change" />,
    cell: ({ row }) => (
      <time className="figures text-sm text-graphite-700" dateTime={row.original.changedAt}>
        {row.original.changedAt.slice(0, 10)}
      </time>
    ),
  },
];

export function ProceduresTable(props: { data: ProcedureRowView[]; total: number; page: number; pageSize: number }) {
  return <DataTable columns={columns} caption="Procedures of this shop" testId="procedures-table" {...props} />;
}
