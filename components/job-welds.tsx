// Every weld joint of a job as the record holds it: where the joint stands, then its rounds in order (the
// first welding, then one per repair after a rejection), each with its passes checked against the WPS
// revision they were welded to and the visual inspection that closed it. Read-only: the job page, and the
// verify page for a signed-in member of the shop.
import { StatusBadge, type Tone } from "@/components/status-badge";
import { JOINT_STATE_LABELS } from "@/lib/jobs/joint";
import type { InspectionView, JobRecord, JointRound, JointState, PassView, StepView } from "@/lib/jobs/record";
import { defaultPadUnit, show } from "@/lib/jobs/units";
import { MEANING_LABELS } from "@/lib/jobs/labels";
import { itemLabel } from "@/lib/traveller/labels";
import { visualCriteriaLabel } from "@/lib/welding";
import type { Step } from "@/lib/procedures/schema";

type System = "metric" | "imperial";
type Weld = Extract<Step, { kind: "weld" }>;

export const JOINT_STATE_TONES: Record<JointState, Tone> = {
  welding: "idle",
  awaiting_inspection: "info",
  repair: "warn",
  accepted: "pass",
};

const METHOD_WORDS: Record<PassView["heatInputMethod"], string> = {
  "voltage-current": "from V, A and travel speed",
  energy: "from the machine's arc energy",
  power: "from the machine's average power",
};

const when = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;
const kj = (v: number) => v.toFixed(2);

/** The pass's heat input against its WPS, as the server judged it when the pass was recorded. */
export function passHeatVerdict(p: PassView): { tone: Tone; label: string; detail: string | null } {
  const f = p.findings.find((x) => x.field === "heatInput");
  if (f && f.value !== null) return { tone: f.ok ? "pass" : "fail", label: f.ok ? "Within WPS" : "Over WPS", detail: f.max !== undefined ? `WPS max ${kj(f.max)} kJ/mm` : null };
  if (f) return { tone: "warn", label: "Not judged", detail: f.message };
  if (p.findings.length) return { tone: "idle", label: "No WPS limit", detail: "The WPS sets no heat-input maximum." };
  return { tone: "idle", label: "Not checked", detail: "No published WPS revision when the pass was recorded." };
}

function heatText(p: PassView, system: System) {
  const f = p.findings.find((x) => x.field === "heatInput" && x.value !== null);
  const judged = f?.value ?? p.arcEnergyKJPerMm;
  const main = system === "imperial" ? `${(judged * 25.4).toFixed(1)} kJ/in (${kj(judged)} kJ/mm)` : `${kj(judged)} kJ/mm`;
  return { main, sub: `arc energy ${kj(p.arcEnergyKJPerMm)} · Q ${kj(p.heatInputKJPerMm)} kJ/mm, ${METHOD_WORDS[p.heatInputMethod]}` };
}

/** What a pass did outside its WPS, and the lead's acceptance of it: the same words in the table and the list. */
function PassNotes({ p, outside }: { p: PassView; outside: PassView["findings"] }) {
  return (
    <>
      {outside.length ? (
        <ul className="text-sm font-semibold text-verdict-fail">
          {outside.map((f) => (
            <li key={f.field}><span aria-hidden="true">✕ </span>Outside the WPS: {f.message}</li>
          ))}
        </ul>
      ) : null}
      {p.override ? (
        <p className="mt-1 rounded border-l-4 border-graphite-700 bg-graphite-50 px-2 py-1 text-sm" data-testid="pass-override">
          <span aria-hidden="true">◆ </span>
          <strong>Accepted by lead override</strong> ({p.override.by.name}, <time className="figures" dateTime={p.override.at}>{when(p.override.at)}</time>): {p.override.reason}
        </p>
      ) : null}
    </>
  );
}

function PassRows({ p, system, spec }: { p: PassView; system: System; spec: Weld }) {
  const t = defaultPadUnit("temperature", system);
  const verdict = passHeatVerdict(p);
  const heat = heatText(p, system);
  const outside = p.findings.filter((f) => !f.ok && f.field !== "heatInput");
  const struck = p.removed ? "line-through decoration-2 text-graphite-600" : "";
  const cols = 10;
  return (
    <>
      <tr className="border-t border-graphite-100 align-top" data-testid={`pass-${p.round}-${p.passNumber}`}>
        <td className={`figures px-2 py-2 font-semibold ${struck}`}>{p.passNumber}</td>
        <td className={`px-2 py-2 ${struck}`}>{p.welder.name}</td>
        <td className={`px-2 py-2 ${struck}`}>
          <span className="figures whitespace-nowrap">{p.wps.reference || spec.wpsRef}</span>
          <span className="block text-sm text-graphite-700">{p.wps.number === null ? "no published revision" : `revision ${p.wps.number}`}</span>
        </td>
        <td className={`figures px-2 py-2 ${struck}`}>{p.position || spec.position}</td>
        <td className={`figures whitespace-nowrap px-2 py-2 ${struck}`}>{p.volts} V<span className="block">{p.amps} A</span></td>
        <td className={`figures px-2 py-2 ${struck}`}>{show("speed", p.travelSpeedMmPerMin, defaultPadUnit("speed", system))}</td>
        <td className={`figures px-2 py-2 ${struck}`}>
          {show("temperature", p.preheatC, t)}
          <span className="block text-sm text-graphite-700">{p.interpassC === null ? "interpass —" : `interpass ${show("temperature", p.interpassC, t)}`}</span>
        </td>
        <td className={`px-2 py-2 ${struck}`}>
          <span className="text-sm">{p.fillerClassification || spec.filler}</span>
          <span className="figures block">lot {p.fillerLot}</span>
        </td>
        <td className={`px-2 py-2 ${struck}`}>
          <span className="figures font-semibold">{heat.main}</span>
          <span className="block text-xs text-graphite-700">{heat.sub}</span>
        </td>
        <td className="whitespace-nowrap px-2 py-2">
          {p.removed ? (
            <StatusBadge tone="idle">Struck out</StatusBadge>
          ) : (
            <>
              <StatusBadge tone={verdict.tone}>{verdict.label}</StatusBadge>
              {verdict.detail ? <span className="figures mt-1 block text-xs text-graphite-700">{verdict.detail}</span> : null}
            </>
          )}
        </td>
      </tr>
      {outside.length || p.override ? (
        <tr className="align-top">
          <td />
          <td colSpan={cols - 1} className="px-2 pb-2">
            <PassNotes p={p} outside={outside} />
          </td>
        </tr>
      ) : null}
    </>
  );
}

function PassItem({ p, system, spec }: { p: PassView; system: System; spec: Weld }) {
  const t = defaultPadUnit("temperature", system);
  const verdict = passHeatVerdict(p);
  const heat = heatText(p, system);
  const outside = p.findings.filter((f) => !f.ok && f.field !== "heatInput");
  const struck = p.removed ? "line-through decoration-2 text-graphite-600" : "";
  return (
    <li className="py-2" data-testid={`pass-${p.round}-${p.passNumber}`}>
      <p className="flex flex-wrap items-center justify-between gap-2">
        <span className={struck}>
          <strong className="figures">Pass {p.passNumber}</strong> · {p.welder.name} · <span className="figures">{p.wps.reference || spec.wpsRef}</span> {p.wps.number === null ? "(no published revision)" : `revision ${p.wps.number}`} · {p.position || spec.position}
        </span>
        {p.removed ? <StatusBadge tone="idle">Struck out</StatusBadge> : null}
      </p>
      <p className={`figures text-sm ${struck}`}>
        {p.volts} V · {p.amps} A · {show("speed", p.travelSpeedMmPerMin, defaultPadUnit("speed", system))} · preheat {show("temperature", p.preheatC, t)}
        {p.interpassC === null ? "" : ` · interpass ${show("temperature", p.interpassC, t)}`} · {p.fillerClassification || spec.filler} lot {p.fillerLot}
      </p>
      <p className={`flex flex-wrap items-center gap-x-2 text-sm ${struck}`}>
        <span>Heat input <span className="figures font-semibold">{heat.main}</span></span>
        {p.removed ? null : <StatusBadge tone={verdict.tone}>{verdict.label}</StatusBadge>}
        {verdict.detail && !p.removed ? <span className="figures">{verdict.detail}</span> : null}
      </p>
      <p className={`text-xs text-graphite-700 ${struck}`}>{heat.sub}</p>
      <PassNotes p={p} outside={outside} />
    </li>
  );
}

function Inspection({ i, record }: { i: InspectionView; record: JobRecord }) {
  const rejected = i.items.filter((x) => !x.ok);
  const accepted = i.decision === "accepted";
  return (
    <div className={`mt-3 rounded-lg border-2 p-3 ${accepted ? "border-verdict-pass" : "border-verdict-fail"}`} data-testid={`inspection-${i.round}`}>
      <p className="flex flex-wrap items-center gap-2">
        <strong>Visual inspection, round {i.round}:</strong>
        <StatusBadge tone={accepted ? "pass" : "fail"}>{accepted ? "Accepted" : "Rejected"}</StatusBadge>
        <span>
          by <strong>{i.inspector.name}</strong> · <time className="figures" dateTime={i.inspectedAt}>{when(i.inspectedAt)}</time>
        </span>
      </p>
      <p className="mt-1 text-sm text-graphite-800">
        Judged by {visualCriteriaLabel(i.criteria)}: the entries {i.judged === "accept" ? "meet" : "fail"} the criteria
        {i.judged === "accept" && !accepted ? "; the inspector rejected the joint for the reason in the notes" : ""}.
      </p>
      {rejected.length ? (
        <table className="mt-2 w-full text-left text-sm" data-testid="rejected-items">
          <caption className="sr-only">Items that failed the criteria</caption>
          <thead className="bg-graphite-100"><tr><th className="px-2 py-1">Failed item</th><th className="px-2 py-1">Measured</th><th className="px-2 py-1">Limit</th></tr></thead>
          <tbody>
            {rejected.map((x) => (
              <tr key={x.item} className="border-t border-graphite-100 align-top">
                <td className="px-2 py-1 font-semibold text-verdict-fail"><span aria-hidden="true">✕ </span>{itemLabel(x.item)}</td>
                <td className="figures px-2 py-1">{x.measured}</td>
                <td className="px-2 py-1">{x.limit}<span className="block text-xs text-graphite-700">{x.source}</span></td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {i.notes ? <p className="mt-2 whitespace-pre-wrap"><strong>Notes:</strong> {i.notes}</p> : null}
      {i.photoIds.length ? (
        <ul className="mt-2 flex flex-wrap gap-2" aria-label={`Photos of the inspection, round ${i.round}`}>
          {i.photoIds.map((id, k) => {
            const ph = record.photos.find((p) => p.id === id);
            return (
              <li key={id}>
                <a href={ph?.url ?? `/api/photos/${id}`} target="_blank" rel="noreferrer" className="block">
                  {/* eslint-disable-next-line @next/next/no-img-element -- served by the photos API to members of the shop only */}
                  <img src={ph?.thumbUrl ?? `/api/photos/${id}?size=thumb`} alt={`Inspection photo ${k + 1}, round ${i.round}${ph?.caption ? `: ${ph.caption}` : ""}`} className="h-24 w-32 rounded border border-graphite-300 object-cover" loading="lazy" />
                </a>
              </li>
            );
          })}
        </ul>
      ) : null}
    </div>
  );
}

function Round({ r, step, record, system, current, compact }: { r: JointRound; step: StepView; record: JobRecord; system: System; current: boolean; compact: boolean }) {
  const spec = step.spec as Weld;
  const live = r.passes.filter((p) => !p.removed).length;
  return (
    <li className="border-t-2 border-graphite-200 pt-3" data-testid={`round-${r.round}`}>
      <h4 className="font-bold">
        Round {r.round} <span className="font-normal text-graphite-700">· {r.round === 1 ? "first welding" : "repair after rejection"} · <span className="figures">{live}</span> pass{live === 1 ? "" : "es"}</span>
      </h4>
      {r.passes.length && compact ? (
        <ul className="mt-1 divide-y divide-graphite-100" aria-label={`Passes of round ${r.round}`}>
          {r.passes.map((p) => <PassItem key={p.id} p={p} system={system} spec={spec} />)}
        </ul>
      ) : r.passes.length ? (
        <div className="mt-2 overflow-x-auto">
          <table className="w-full min-w-[56rem] text-left">
            <caption className="sr-only">Passes of round {r.round}</caption>
            <thead className="bg-graphite-100 text-sm">
              <tr>
                <th className="px-2 py-1">Pass</th><th className="px-2 py-1">Welder</th><th className="px-2 py-1">WPS</th><th className="px-2 py-1">Position</th><th className="px-2 py-1">Volts · amps</th><th className="px-2 py-1">Travel</th><th className="px-2 py-1">Preheat</th><th className="px-2 py-1">Filler</th><th className="px-2 py-1">Heat input</th><th className="px-2 py-1">Heat input against the WPS</th>
              </tr>
            </thead>
            <tbody>
              {r.passes.map((p) => <PassRows key={p.id} p={p} system={system} spec={spec} />)}
            </tbody>
          </table>
        </div>
      ) : (
        <p className="mt-1 text-graphite-700">No passes recorded in this round yet.</p>
      )}
      <p className="mt-2 text-sm">
        {r.performed ? (
          <>
            <span aria-hidden="true">● </span>
            {MEANING_LABELS.performed} and signed by <strong>{r.performed.printedName}</strong> · <time className="figures" dateTime={r.performed.signedAt}>{when(r.performed.signedAt)}</time>
          </>
        ) : (
          <><span aria-hidden="true">○ </span>Not signed by the welder yet.</>
        )}
      </p>
      {r.inspection ? <Inspection i={r.inspection} record={record} /> : current && r.performed ? <p className="mt-2"><StatusBadge tone="info">Waiting for inspection</StatusBadge></p> : null}
    </li>
  );
}

/** `compact` lists each pass in lines instead of a wide table, for narrow pages (the verify page). */
export function JobWelds({ record, system, compact = false }: { record: JobRecord; system: System; compact?: boolean }) {
  const welds = record.steps.filter((s) => s.kind === "weld");
  if (!welds.length) return <p className="card p-4">No weld joints on this checklist.</p>;
  const len = defaultPadUnit("length", system);
  return (
    <div className="space-y-4" data-testid="welds">
      {welds.map((s) => {
        const spec = s.spec as Weld;
        const joint = s.joint;
        const state = joint?.state ?? "welding";
        return (
          <section key={s.id} className="card p-4" aria-labelledby={`joint-${s.id}`} data-testid={`joint-${spec.jointId}`}>
            <div className="flex flex-wrap items-center justify-between gap-2">
              <h3 id={`joint-${s.id}`} className="text-lg font-bold">
                <span className="figures">{spec.jointId}</span> · {s.title}
              </h3>
              <span className="flex items-center gap-2">
                <StatusBadge tone={JOINT_STATE_TONES[state]} testId="joint-state">{JOINT_STATE_LABELS[state]}</StatusBadge>
                {joint ? <span className="text-sm text-graphite-700">{joint.state === "accepted" ? `${joint.rounds.length} round${joint.rounds.length === 1 ? "" : "s"}` : `round ${joint.round}`}</span> : null}
              </span>
            </div>
            <p className="mt-1 text-sm text-graphite-800">
              {spec.jointType} {show("length", spec.sizeMm, len)} × {show("length", spec.lengthMm, len)} · {spec.position} · {spec.process} · WPS <span className="figures">{spec.wpsRef}</span> · {spec.filler} · preheat at least {show("temperature", spec.minPreheatC, defaultPadUnit("temperature", system))}
            </p>
            {joint?.uncovered.length ? (
              <ul className="mt-2 rounded border-2 border-verdict-warn bg-verdict-warnbg p-2 text-sm font-semibold text-verdict-warn" data-testid="uncovered-passes">
                {joint.uncovered.map((u) => (
                  <li key={u.passNumber}><span aria-hidden="true">▲ </span>Pass {u.passNumber} is outside the WPS with no lead override and no dispositioned nonconformance: {u.messages.join(" ")}</li>
                ))}
              </ul>
            ) : null}
            <ol className="mt-3 space-y-3">
              {(joint?.rounds ?? []).map((r) => (
                <Round key={r.round} r={r} step={s} record={record} system={system} current={r.round === joint?.round} compact={compact} />
              ))}
            </ol>
          </section>
        );
      })}
    </div>
  );
}
