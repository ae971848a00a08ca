"use client";
import { useActionState } from "react";
import { FormMessage } from "@/components/form-message";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/authz";
import { resetMemberPin, saveActive, saveLegalName, saveRoles } from "../actions";

export function RolesForm({ membershipId, roles, name }: { membershipId: string; roles: Role[]; name: string }) {
  const [state, action, pending] = useActionState(saveRoles, undefined);
  const error = state?.error ? Object.values(state.error).flat().filter(Boolean) as string[] : undefined;
  return (
    <form action={action} className="min-w-[19rem] space-y-1" aria-label={`Roles of ${name}`}>
      <input type="hidden" name="membershipId" value={membershipId} />
      <div className="flex flex-wrap gap-1">
        {ROLES.map((r) => (
          <label key={r} className="flex min-h-11 items-center gap-1 rounded border border-graphite-300 px-2 text-sm">
            <input type="checkbox" name="roles" value={r} defaultChecked={roles.includes(r)} className="h-5 w-5" />
            {ROLE_LABELS[r]}
          </label>
        ))}
        <button type="submit" className="btn btn-quiet text-sm" disabled={pending}>Save roles</button>
      </div>
      <FormMessage ok={state?.ok} errors={error} />
    </form>
  );
}

export function ActiveForm({ membershipId, active, name }: { membershipId: string; active: boolean; name: string }) {
  const [state, action, pending] = useActionState(saveActive, undefined);
  const error = state?.error ? Object.values(state.error).flat().filter(Boolean) as string[] : undefined;
  return (
    <form action={action} aria-label={`${active ? "Deactivate" : "Reactivate"} ${name}`}>
      <input type="hidden" name="membershipId" value={membershipId} />
      <input type="hidden" name="active" value={active ? "false" : "true"} />
      <button type="submit" className={`btn ${active ? "btn-danger" : "btn-quiet"} text-sm`} disabled={pending}>
        {active ? "Deactivate" : "Reactivate"}
      </button>
      <FormMessage ok={state?.ok} errors={error} />
    </form>
  );
}

export function PinResetForm({ membershipId, name }: { membershipId: string; name: string }) {
  const [state, action, pending] = useActionState(resetMemberPin, undefined);
  const error = state?.error ? Object.values(state.error).flat().filter(Boolean) as string[] : undefined;
  return (
    <form action={action} aria-label={`Reset the PIN of ${name}`}>
      <input type="hidden" name="membershipId" value={membershipId} />
      <button type="submit" className="btn btn-quiet text-sm" disabled={pending}>Reset PIN</button>
      <FormMessage ok={state?.ok} errors={error} />
    </form>
  );
}

export function LegalNameForm({ membershipId, legalName }: { membershipId: string; legalName: string }) {
  const [state, action, pending] = useActionState(saveLegalName, undefined);
  const error = state?.error ? Object.values(state.error).flat().filter(Boolean) as string[] : undefined;
  const id = `legal-${membershipId}`;
  return (
    <form action={action} className="min-w-[14rem] space-y-1" aria-label={`Name printed on sign-offs of ${legalName}`}>
      <input type="hidden" name="membershipId" value={membershipId} />
      <label htmlFor={id} className="text-sm text-graphite-700">Printed on sign-offs</label>
      <div className="flex gap-1">
        <input id={id} name="legalName" className="field-input min-h-11" defaultValue={legalName} maxLength={120} autoComplete="off" data-testid="legal-name" />
        <button type="submit" className="btn btn-quiet text-sm" disabled={pending}>Save</button>
      </div>
      <FormMessage ok={state?.ok} errors={error} />
    </form>
  );
}
