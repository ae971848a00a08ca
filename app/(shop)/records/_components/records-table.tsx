"use client";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";

type RecordRow = { id: string; number: string; customerName: string; vin: string; axleTag: string; vehicle: string; procedure: string; releasedAt: string | null };

const columns: ColumnDef<RecordRow, unknown>[] = [
  { header: "Job", cell: ({ row }) => <Link className="figures font-semibold underline" href={`/jobs/${row.original.id}`}>{row.original.number}</Link> },
  { header: "Released", cell: ({ row }) => <span className="figures">{row.original.releasedAt?.slice(0, 10) ?? ""}</span> },
  { header: "Customer", accessorKey: "customerName" },
  { header: "Vehicle / VIN", cell: ({ row }) => <div><div>{row.original.vehicle}</div><div className="figures text-sm text-graphite-600">{row.original.vin}</div></div> },
  { header: "Axle tag", cell: ({ row }) => <span className="figures">{row.original.axleTag}</span> },
  { header: "Procedure", accessorKey: "procedure" },
  { header: "Record", cell: ({ row }) => <a className="btn btn-quiet text-sm" href={`/api/jobs/${row.original.id}/export.csv`}>CSV</a> },
];

export function RecordsTable(props: { data: RecordRow[]; total: number; page: number; pageSize: number }) {
  return <DataTable columns={columns} caption="Released jobs" testId="records-table" {...props} />;
}
