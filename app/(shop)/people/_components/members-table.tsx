"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/data-table";
import { StatusBadge } from "@/components/status-badge";
import { ROLE_LABELS, type Role } from "@/lib/authz";
import { ActiveForm, LegalNameForm, PinResetForm, RoleChecks, RolesSaveBar } from "./member-actions";

type MemberView = {
  membershipId: string;
  name: string;
  legalName: string;
  email: string;
  roles: Role[];
  active: boolean;
  hasPin: boolean;
  pinLocked: boolean;
  isMe: boolean;
};

const columns: ColumnDef<MemberView, unknown>[] = [
  {
    header: "Person",
    cell: ({ row }) => (
      <div>
        <div className="font-semibold">{row.original.legalName}{row.original.isMe ? " (you)" : ""}</div>
        {row.original.name !== row.original.legalName ? <div className="text-sm text-graphite-600">Account name: {row.original.name}</div> : null}
        <div className="text-sm text-graphite-600">{row.original.email}</div>
        {row.original.active ? <div className="mt-1"><LegalNameForm membershipId={row.original.membershipId} legalName={row.original.legalName} /></div> : null}
        <div className="mt-1">
          {row.original.active ? <StatusBadge tone="pass">Active</StatusBadge> : <StatusBadge tone="idle">Deactivated</StatusBadge>}
        </div>
      </div>
    ),
  },
  {
    header: "Roles",
    cell: ({ row }) =>
      row.original.active ? (
        <RoleChecks index={row.index} membershipId={row.original.membershipId} roles={row.original.roles} name={row.original.name} />
      ) : (
        <span>{row.original.roles.map((r) => ROLE_LABELS[r]).join(", ")}</span>
      ),
  },
  {
    header: "Signing PIN",
    cell: ({ row }) => (
      <div className="space-y-1">
        {row.original.pinLocked ? <StatusBadge tone="fail">Locked</StatusBadge> : row.original.hasPin ? <StatusBadge tone="pass">Set</StatusBadge> : <StatusBadge tone="warn">Not set</StatusBadge>}
        {row.original.active && (row.original.hasPin || row.original.pinLocked) ? <PinResetForm membershipId={row.original.membershipId} name={row.original.name} /> : null}
      </div>
    ),
  },
  {
    header: "Membership",
    cell: ({ row }) => (row.original.isMe ? null : <ActiveForm membershipId={row.original.membershipId} active={row.original.active} name={row.original.name} />),
  },
];

export function MembersTable(props: { data: MemberView[]; total: number; page: number; pageSize: number }) {
  return (
    <div className="space-y-3">
      <DataTable columns={columns} caption="Members of this shop" testId="members-table" {...props} />
      {props.data.some((m) => m.active) ? <RolesSaveBar /> : null}
    </div>
  );
}
