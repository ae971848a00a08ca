"use client";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";
import type { VersionStatus } from "@/lib/procedures/labels";
import { VersionStatusBadge } from "./status";

type HistoryRow = {
  number: number;
  status: VersionStatus;
  changeNote: string | null;
  authorName: string | null;
  publisherName: string | null;
  updatedAt: string;
  publishedAt: string | null;
  retiredAt: string | null;
  contentHash: string | null;
  stepCount: number;
  procedureId: string;
  previous: number | null;
};

const when = (iso: string | null) => (iso ? `${iso.slice(0, 16).replace("T", " ")} UTC` : "—");

const columns: ColumnDef<HistoryRow, unknown>[] = [
  {
    id: "version",
    header: "Version",
    cell: ({ row }) => (
      <Link href={`/procedures/${row.original.procedureId}/versions/${row.original.number}`} className="inline-flex min-h-11 items-center" aria-label={`Version ${row.original.number}, ${row.original.status}`}>
        <VersionStatusBadge status={row.original.status} number={row.original.number} />
      </Link>
    ),
  },
  {
    id: "note",
    header: "Change note",
    cell: ({ row }) => <p className="min-w-[14rem] max-w-md text-sm">{row.original.changeNote ?? <span className="text-graphite-600">Not published yet.</span>}</p>,
  },
  {
    id: "who",
    header: "Author · publisher",
    cell: ({ row }) => (
      <div className="text-sm">
        <div>{row.original.authorName ?? "—"}</div>
        {row.original.publisherName ? <div className="text-graphite-600">published by {row.original.publisherName}</div> : null}
      </div>
    ),
  },
  {
    id: "when",
    header: "When",
    cell: ({ row }) => (
      <div className="figures space-y-0.5 text-xs text-graphite-700">
        {row.original.publishedAt ? <div>Published {when(row.original.publishedAt)}</div> : <div>Edited {when(row.original.updatedAt)}</div>}
        {row.original.retiredAt ? <div>Retired {when(row.original.retiredAt)}</div> : null}
      </div>
    ),
  },
  { id: "steps", header: "Steps", cell: ({ row }) => <span className="figures">{row.original.stepCount}</span> },
  {
    id: "hash",
    header: "SHA-256",
    cell: ({ row }) => (row.original.contentHash ? <code className="figures text-xs" title={row.original.contentHash}>{row.original.contentHash.slice(0, 12)}…</code> : <span className="text-sm text-graphite-600">—</span>),
  },
  {
    id: "compare",
    header: "Compare",
    cell: ({ row }) =>
      row.original.previous ? (
        <Link className="btn btn-quiet text-sm" href={`/procedures/${row.original.procedureId}/diff?from=${row.original.previous}&to=${row.original.number}`}>
          v{row.original.previous} → v{row.original.number}
        </Link>
      ) : null,
  },
];

export function HistoryTable(props: { data: HistoryRow[]; total: number; page: number; pageSize: number }) {
  return <DataTable columns={columns} caption="Version history" testId="version-history" {...props} />;
}
