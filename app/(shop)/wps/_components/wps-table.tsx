"use client";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";
import type { WpsProcess, WpsState } from "@/lib/welding/wps-schema";
import { WpsStatusBadge } from "./badges";

type WpsListView = {
  id: string;
  reference: string;
  title: string;
  process: WpsProcess | null;
  iso4063: number | null;
  state: WpsState;
  publishedNumber: number | null;
  draftNumber: number | null;
  latestNumber: number;
  shownNumber: number;
  changedOn: string;
};

const columns: ColumnDef<WpsListView, unknown>[] = [
  {
    header: "Reference",
    cell: ({ row }) => (
      <Link href={`/wps/${row.original.id}`} className="figures whitespace-nowrap font-semibold text-graphite-950 underline decoration-primer-600 underline-offset-4">
        {row.original.reference}
      </Link>
    ),
  },
  { header: "Title", cell: ({ row }) => <span>{row.original.title || "(untitled draft)"}</span> },
  {
    header: "Process",
    cell: ({ row }) =>
      row.original.process ? (
        <span className="whitespace-nowrap">
          {row.original.process}
          {row.original.iso4063 ? <span className="figures text-graphite-600"> · ISO {row.original.iso4063}</span> : null}
        </span>
      ) : (
        "—"
      ),
  },
  {
    header: "State",
    cell: ({ row }) => {
      const r = row.original;
      return (
        <div className="space-y-1 whitespace-nowrap">
          <WpsStatusBadge status={r.state} number={r.shownNumber} />
          {r.state !== "draft" && r.draftNumber ? (
            <div className="text-sm text-graphite-600">
              Draft <span className="figures">rev {r.draftNumber}</span> open
            </div>
          ) : null}
        </div>
      );
    },
  },
  { header: "Changed", cell: ({ row }) => <span className="figures whitespace-nowrap">{row.original.changedOn}</span> },
];

export function WpsTable(props: { data: WpsListView[]; total: number; page: number; pageSize: number }) {
  return <DataTable columns={columns} caption="WPS library" testId="wps-table" {...props} />;
}
