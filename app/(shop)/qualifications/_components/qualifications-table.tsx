"use client";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";
import type { ContinuityStatus } from "@/lib/welding/continuity";
import { ContinuityBadge } from "../../wps/_components/badges";

export type QualificationView = {
  id: string;
  welderName: string;
  process: string;
  positions: string[];
  thickness: string;
  diameter: string;
  fillerFNumber: number;
  testDate: string;
  lastUsedOn: string;
  status: ContinuityStatus;
  expiresOn: string;
  lastValidOn: string;
  daysLeft: number;
  hasCertificate: boolean;
};

const columns: ColumnDef<QualificationView, unknown>[] = [
  {
    header: "Welder",
    cell: ({ row }) => (
      <Link href={`/qualifications/${row.original.id}`} className="whitespace-nowrap font-semibold underline decoration-primer-600 underline-offset-4">
        {row.original.welderName}
      </Link>
    ),
  },
  { header: "Process", cell: ({ row }) => <span className="font-semibold">{row.original.process}</span> },
  { header: "Positions", cell: ({ row }) => <span className="figures text-sm">{row.original.positions.join(" ")}</span> },
  {
    header: "Thickness · diameter",
    cell: ({ row }) => (
      <span className="figures block min-w-32 text-sm">
        {row.original.thickness}
        <span className="block text-graphite-600">⌀ {row.original.diameter}</span>
      </span>
    ),
  },
  { header: "F-No.", cell: ({ row }) => <span className="figures">{row.original.fillerFNumber}</span> },
  {
    header: "Tested · last used",
    cell: ({ row }) => (
      <span className="figures whitespace-nowrap text-sm">
        <span className="block">test {row.original.testDate}</span>
        <span className="block">used {row.original.lastUsedOn}</span>
      </span>
    ),
  },
  {
    header: "Lapses on",
    cell: ({ row }) => (
      <span className="figures whitespace-nowrap">
        <span className="block" data-testid="expires-on">{row.original.expiresOn}</span>
        <span className="block text-sm text-graphite-600">{row.original.daysLeft > 0 ? `${row.original.daysLeft} day${row.original.daysLeft === 1 ? "" : "s"} left` : "lapsed"}</span>
      </span>
    ),
  },
  {
    header: "Continuity",
    cell: ({ row }) => <ContinuityBadge compact status={row.original.status} daysLeft={row.original.daysLeft} expiresOn={row.original.expiresOn} testId="continuity" />,
  },
  {
    header: "Certificate",
    cell: ({ row }) =>
      row.original.hasCertificate ? (
        <a className="underline underline-offset-4" href={`/api/qualifications/${row.original.id}/certificate`} download>
          Download
        </a>
      ) : (
        <span className="text-sm text-graphite-600">None yet</span>
      ),
  },
];

export function QualificationsTable(props: { data: QualificationView[]; total: number; page: number; pageSize: number }) {
  return <DataTable columns={columns} caption="Welder qualifications and their continuity" testId="qualifications-table" {...props} />;
}
