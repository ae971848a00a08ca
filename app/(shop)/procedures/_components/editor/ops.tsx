"use client";
import { useActionState, useState } from "react";
import type { FormState } from "@/lib/api/action";
import { sectionOpAction, stepOpAction } from "../../actions";

function firstError(state: FormState | undefined): string | undefined {
  if (!state?.error) return undefined;
  return (Object.values(state.error).flat().filter(Boolean) as string[])[0];
}

const iconBtn = "btn btn-quiet min-w-11 px-2 text-base";

// Move, duplicate and delete one step. Delete asks once more; nothing here is dragged.
export function StepOps({ procedureId, number, stepKey, title }: { procedureId: string; number: number; stepKey: string; title: string }) {
  const [state, action, pending] = useActionState(stepOpAction, undefined);
  const [confirming, setConfirming] = useState(false);
  const error = firstError(state);
  return (
    <form action={action} className="flex flex-wrap items-center gap-1" aria-label={`Arrange step ${title}`} data-testid={`ops-${stepKey}`}>
      <input type="hidden" name="procedureId" value={procedureId} />
      <input type="hidden" name="number" value={number} />
      <input type="hidden" name="stepKey" value={stepKey} />
      {confirming ? (
        <>
          <button type="submit" name="op" value="delete" className="btn btn-danger px-2 text-sm" disabled={pending}>Delete it</button>
          <button type="button" className="btn btn-quiet px-2 text-sm" onClick={() => setConfirming(false)}>Keep</button>
        </>
      ) : (
        <>
          <button type="submit" name="op" value="up" className={iconBtn} disabled={pending} aria-label={`Move “${title}” up`} title="Move up">↑</button>
          <button type="submit" name="op" value="down" className={iconBtn} disabled={pending} aria-label={`Move “${title}” down`} title="Move down">↓</button>
          <button type="submit" name="op" value="duplicate" className="btn btn-quiet px-3 text-sm" disabled={pending} aria-label={`Duplicate “${title}”`} title="Duplicate">Duplicate</button>
          <button type="button" className="btn btn-danger px-3 text-sm" onClick={() => setConfirming(true)} aria-label={`Delete “${title}”`} title="Delete">✕ Delete</button>
        </>
      )}
      {error ? <p className="basis-full text-sm font-semibold text-verdict-fail" role="status"><span aria-hidden="true">✕ </span>{error}</p> : null}
    </form>
  );
}

export function SectionOps({ procedureId, number, sectionKey, title, stepCount }: { procedureId: string; number: number; sectionKey: string; title: string; stepCount: number }) {
  const [state, action, pending] = useActionState(sectionOpAction, undefined);
  const [confirming, setConfirming] = useState(false);
  const error = firstError(state);
  return (
    <form action={action} className="flex flex-wrap items-center gap-1" aria-label={`Arrange section ${title}`}>
      <input type="hidden" name="procedureId" value={procedureId} />
      <input type="hidden" name="number" value={number} />
      <input type="hidden" name="sectionKey" value={sectionKey} />
      {confirming ? (
        <>
          <span className="text-sm font-semibold text-verdict-warn"><span aria-hidden="true">▲ </span>{stepCount ? `Delete with its ${stepCount} steps?` : "Delete this section?"}</span>
          <button type="submit" name="op" value="delete" className="btn btn-danger px-2 text-sm" disabled={pending}>Delete</button>
          <button type="button" className="btn btn-quiet px-2 text-sm" onClick={() => setConfirming(false)}>Keep</button>
        </>
      ) : (
        <>
          <button type="submit" name="op" value="up" className={iconBtn} disabled={pending} aria-label={`Move section “${title}” up`} title="Move section up">↑</button>
          <button type="submit" name="op" value="down" className={iconBtn} disabled={pending} aria-label={`Move section “${title}” down`} title="Move section down">↓</button>
          <button type="button" className={`${iconBtn} text-verdict-fail`} onClick={() => setConfirming(true)} aria-label={`Delete section “${title}”`} title="Delete section">✕</button>
        </>
      )}
      {error ? <p className="basis-full text-sm font-semibold text-verdict-fail" role="status"><span aria-hidden="true">✕ </span>{error}</p> : null}
    </form>
  );
}
