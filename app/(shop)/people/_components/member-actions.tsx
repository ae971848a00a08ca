"use client";
import { useActionState } from "react";
import { FormMessage } from "@/components/form-message";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/authz";
import { resetMemberPin, saveActive, saveLegalName, saveRoles } from "../actions";

export const ROLES_FORM_ID = "roles-form";

// One person's role boxes. They belong to the page's one roles form (by the `form` attribute), so the table
// keeps its rows while a single Save sends every person's roles.
export function RoleChecks({ index, membershipId, roles, name }: { index: number; membershipId: string; roles: Role[]; name: string }) {
  return (
    <fieldset className="min-w-[19rem]" aria-label={`Roles of ${name}`}>
      <input type="hidden" form={ROLES_FORM_ID} name={`members[${index}].membershipId`} value={membershipId} />
      <input type="hidden" form={ROLES_FORM_ID} name={`members[${index}].name`} value={name} />
      <div className="flex flex-wrap gap-1">
        {ROLES.map((r) => (
          <label key={r} className="flex min-h-11 items-center gap-1 rounded border border-graphite-300 px-2 text-sm">
            <input type="checkbox" form={ROLES_FORM_ID} name={`members[${index}].roles`} value={r} defaultChecked={roles.includes(r)} className="h-5 w-5" />
            {ROLE_LABELS[r]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export function RolesSaveBar() {
  const [state, action, pending] = useActionState(saveRoles, undefined);
  const error = state?.error ? (Object.values(state.error).flat().filter(Boolean) as string[]) : undefined;
  return (
    // Kept in view at the foot of the screen while the lead works down the table.
    <form id={ROLES_FORM_ID} action={action} className="card sticky bottom-2 z-10 flex flex-wrap items-center gap-3 p-3 shadow-md" aria-label="Roles of everyone listed">
      <button type="submit" className="btn btn-primary" disabled={pending}>
        {pending ? "Saving roles…" : "Save roles"}
      </button>
      <span className="text-sm text-graphite-600">Tick the roles in the table, then save once for everyone listed.</span>
      <div className="basis-full empty:hidden" aria-live="polite">
        <FormMessage ok={state?.ok} errors={error} testId="roles" />
      </div>
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
