import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { JOINT_STATE_TONES, JobWelds } from "@/components/job-welds";
import { RecordWeldMap } from "@/components/weld-map/record-weld-map";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { SignOffList } from "@/components/runner/sign-off-list";
import { StatusBadge } from "@/components/status-badge";
import { jobActivityPage, jobFormOptions } from "@/db/queries/jobs";
import { getJobRecord } from "@/db/queries/jobs-core";
import { verifyJobRecord } from "@/db/queries/records";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { AppError } from "@/lib/errors";
import { describeJobActivity } from "@/lib/jobs/activity";
import { JOINT_STATE_LABELS } from "@/lib/jobs/joint";
import { JOB_STATE_LABELS } from "@/lib/jobs/labels";
import type { JobRecord } from "@/lib/jobs/record";
import { valueSummary } from "@/lib/jobs/summary";
import { measureBounds, torqueBounds } from "@/lib/jobs/tolerance";
import { defaultPadUnit, show, type PadQuantity } from "@/lib/jobs/units";
import type { GeometryCapture, GeometryValue } from "@/lib/jobs/values";
import { roadTestNote, worstSteeringWheelDeg } from "@/lib/jobs/geometry";
import { KIND_LABELS } from "@/lib/procedures/labels";
import { kindGlyph } from "@/components/runner/glyph";
import { GeometryChart } from "./_components/geometry-chart";
import { EditJob } from "./_components/edit-job";
import { ReleaseButton, VoidForm } from "./_components/job-actions";
import { MaterialsPanel } from "./_components/materials-panel";
import { NcList } from "./_components/nc-list";

export const metadata: Metadata = { title: "Job" };
export const dynamic = "force-dynamic";

const TABS = [
  ["checklist", "Checklist"],
  ["welds", "Welds"],
  ["materials", "Materials"],
  ["measurements", "Measurements"],
  ["photos", "Photos"],
  ["nonconformances", "Nonconformances"],
  ["activity", "Activity"],
] as const;
type Tab = (typeof TABS)[number][0];

const fmt = (iso: string | null) => (iso ? `${iso.slice(0, 16).replace("T", " ")} UTC` : "—");

export default async function JobPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("job:read");
  const id = z.uuid().safeParse((await params).id);
  if (!id.success) notFound();
  const sp = await searchParams;
  const tab: Tab = (TABS.find(([t]) => t === sp.tab)?.[0] ?? "checklist") as Tab;
  let record: JobRecord;
  try {
    record = await getJobRecord(ctx, id.data);
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  }
  const j = record.job;
  // The screen shows signed values from the sealed sign-offs; a stored row that no longer agrees is named here.
  const integrity = await verifyJobRecord(j.id);
  const state = JOB_STATE_LABELS[j.status];
  const pct = j.stepsTotal ? Math.round((j.stepsSigned / j.stepsTotal) * 100) : 0;
  const open = j.status !== "released" && j.status !== "void";
  const system = ctx.unitSystem;
  return (
    <>
      <PageHeader title={j.number} lead={`${j.customerName} · ${[j.vehicleYear, j.vehicleMakeModel].filter(Boolean).join(" ")} · axle ${j.axleTag}`}>
        <Link href={`/run/${j.id}`} className="btn btn-primary min-h-12 px-5" data-testid="open-runner">{open ? "Open checklist" : "View checklist"}</Link>
      </PageHeader>
      {!integrity.intact ? (
        <section className="mb-4 rounded-lg border-4 border-verdict-fail bg-verdict-failbg p-4 text-verdict-fail" data-testid="record-altered">
          <p className="flex items-center gap-2 text-xl font-bold"><span aria-hidden="true">✕</span>Record altered at entry {integrity.firstBrokenSeq ?? "?"}</p>
          <p className="mt-1 text-graphite-900">{integrity.reason ?? "The record chain does not verify."} Signed values on this page are the ones sealed at signing.</p>
        </section>
      ) : null}
      <div className="grid gap-4 lg:grid-cols-[1fr_20rem]">
        <section className="card p-4" aria-labelledby="hdr-h">
          <h2 id="hdr-h" className="sr-only">Job details</h2>
          <div className="flex flex-wrap items-center gap-3">
            <span data-testid="job-state"><StatusBadge tone={state.tone}>{state.label}</StatusBadge></span>
            <span className="figures font-semibold" data-testid="job-progress">{j.stepsSigned} of {j.stepsTotal} steps signed</span>
            {j.openNonconformances ? <StatusBadge tone="fail">{j.openNonconformances} open NC</StatusBadge> : null}
          </div>
          <div className="mt-2 h-3 overflow-hidden rounded-full bg-graphite-200" role="progressbar" aria-valuemin={0} aria-valuemax={j.stepsTotal} aria-valuenow={j.stepsSigned} aria-label="Steps signed">
            <div className="h-full bg-graphite-800" style={{ width: `${pct}%` }} />
          </div>
          <dl className="mt-4 grid gap-x-6 gap-y-2 sm:grid-cols-2 xl:grid-cols-3">
            {[
              ["Customer", <>{j.customerName}<br /><span className="text-sm text-graphite-700">{[j.customerPhone, j.customerEmail].filter(Boolean).join(" · ")}</span></>],
              ["Vehicle", [j.vehicleYear, j.vehicleMakeModel].filter(Boolean).join(" ") || "—"],
              [
                "VIN",
                <>
                  <span className="figures">{j.vin || "—"}</span>
                  {j.vinWarning ? <span className="mt-1 block text-sm font-semibold text-verdict-warn" data-testid="vin-warning">▲ {j.vinWarning}</span> : j.vin ? <span className="block text-sm text-verdict-pass">● check digit matches</span> : null}
                </>,
              ],
              ["Axle", <>{j.axleDescription}<br /><span className="figures text-sm">tag {j.axleTag}</span></>],
              ["Procedure", `${j.procedureTitle} · version ${j.procedureVersionNumber} (pinned)`],
              ["Welders", j.welders.map((w) => w.name).join(", ") || "—"],
              ["Inspector", j.inspector?.name ?? "—"],
              ["Due", j.dueDate ?? "—"],
              ["Created", `${fmt(j.createdAt)} by ${j.createdBy.name}`],
              ...(j.releasedAt ? [["Released", `${fmt(j.releasedAt)} by ${j.releasedBy?.name ?? ""}`] as const] : []),
              ...(j.voidedAt ? [["Void", `${fmt(j.voidedAt)}: ${j.voidReason ?? ""}`] as const] : []),
            ].map(([k, v], i) => (
              <div key={i}>
                <dt className="text-sm font-semibold text-graphite-700">{k}</dt>
                <dd>{v}</dd>
              </div>
            ))}
          </dl>
          {j.notes ? <p className="mt-3 whitespace-pre-wrap rounded bg-graphite-50 p-2">{j.notes}</p> : null}
        </section>
        <aside className="space-y-3">
          {open && can(ctx.roles, "job:release") ? <ReleaseButton jobId={j.id} number={j.number} me={ctx.user.name} blockers={record.releaseBlockers} /> : null}
          {open && can(ctx.roles, "job:write") ? <EditJob job={j} options={await jobFormOptions(ctx.shopId)} /> : null}
          {open && can(ctx.roles, "job:write") ? <VoidForm jobId={j.id} /> : null}
          {record.releaseSignOff ? <SignOffList signOffs={[record.releaseSignOff]} /> : null}
        </aside>
      </div>

      <nav aria-label="Job sections" className="mt-6 flex flex-wrap gap-2 border-b-2 border-graphite-200">
        {TABS.map(([t, label]) => (
          <Link
            key={t}
            href={`/jobs/${j.id}?tab=${t}`}
            aria-current={tab === t ? "page" : undefined}
            className={`-mb-0.5 flex min-h-11 items-center border-b-4 px-3 font-semibold ${tab === t ? "border-graphite-950 text-graphite-950" : "border-transparent text-graphite-700"}`}
            data-testid={`tab-${t}`}
          >
            {tab === t ? <span aria-hidden="true" className="mr-1">▸</span> : null}
            {label}
            {t === "nonconformances" && record.nonconformances.length ? <span className="figures ml-1">({record.nonconformances.length})</span> : null}
            {t === "photos" ? <span className="figures ml-1">({record.photos.filter((p) => !p.removed).length})</span> : null}
            {t === "welds" ? <span className="figures ml-1">({record.steps.filter((s) => s.kind === "weld").length})</span> : null}
            {t === "materials" ? <span className="figures ml-1">({record.materials.filter((m) => !m.superseded && !m.withdrawn).length})</span> : null}
          </Link>
        ))}
      </nav>
      <div className="mt-4">
        {tab === "checklist" ? <ChecklistTab record={record} system={system} /> : null}
        {tab === "welds" ? <RecordWeldMap record={record} testId="job-weld-map" /> : null}
        {tab === "welds" ? <JobWelds record={record} system={system} /> : null}
        {tab === "materials" ? <MaterialsPanel jobId={j.id} materials={record.materials} canRecord={open && can(ctx.roles, "material:record")} /> : null}
        {tab === "measurements" ? <MeasurementsTab record={record} system={system} /> : null}
        {tab === "photos" ? <PhotosTab record={record} /> : null}
        {tab === "nonconformances" ? <NcList record={record} /> : null}
        {tab === "activity" ? <ActivityTab shopId={ctx.shopId} jobId={j.id} page={Math.max(1, Number(sp.page ?? 1) || 1)} /> : null}
      </div>
    </>
  );
}

function ChecklistTab({ record, system }: { record: JobRecord; system: "metric" | "imperial" }) {
  const sections: { key: string; title: string; steps: JobRecord["steps"] }[] = [];
  for (const s of record.steps) {
    const last = sections[sections.length - 1];
    if (last && last.key === s.sectionKey) last.steps.push(s);
    else sections.push({ key: s.sectionKey, title: s.sectionTitle, steps: [s] });
  }
  return (
    <div className="space-y-4" data-testid="checklist">
      {sections.map((sec) => (
        <section key={sec.key} className="card p-4" aria-labelledby={`sec-${sec.key}`}>
          <h3 id={`sec-${sec.key}`} className="font-bold">{sec.title} <span className="figures font-normal text-graphite-700">({sec.steps.filter((s) => s.signed).length}/{sec.steps.length})</span></h3>
          <ol className="mt-2 divide-y divide-graphite-100">
            {sec.steps.map((s) => {
              const passes = record.passes.filter((p) => p.stepId === s.id && !p.removed).length;
              const nc = record.nonconformances.find((n) => n.stepId === s.id && !n.disposition);
              return (
                <li key={s.id} className="py-2" data-testid={`checklist-step-${s.key}`}>
                  <div className="flex flex-wrap items-start justify-between gap-2">
                    <Link href={`/run/${record.job.id}?step=${s.key}`} className="font-semibold underline-offset-2 hover:underline">
                      <span aria-hidden="true" className="mr-1">{kindGlyph(s.kind)}</span>
                      {s.position}. {s.title} <span className="text-sm font-normal text-graphite-700">({KIND_LABELS[s.kind]})</span>
                    </Link>
                    <span className="flex flex-wrap items-center gap-2">
                      {s.joint ? (
                        <Link href={`/jobs/${record.job.id}?tab=welds`} className="underline-offset-2 hover:underline" data-testid="checklist-joint-state">
                          <StatusBadge tone={JOINT_STATE_TONES[s.joint.state]}>{`${JOINT_STATE_LABELS[s.joint.state]} · round ${s.joint.round}`}</StatusBadge>
                        </Link>
                      ) : null}
                      {s.signed ? <StatusBadge tone="pass">Signed</StatusBadge> : nc ? <StatusBadge tone="fail">NC-{nc.number} open</StatusBadge> : s.lockedBy ? <StatusBadge tone="warn">Locked</StatusBadge> : <StatusBadge tone="idle">Open</StatusBadge>}
                    </span>
                  </div>
                  <p className="text-sm text-graphite-800">{valueSummary(s.spec, s.effectiveValue, system, passes)}</p>
                  {s.signOffs.length ? <div className="mt-2"><SignOffList signOffs={s.signOffs} summary={(o) => (o.amendsSignOffId ? valueSummary(s.spec, o.value, system, passes) : s.joint && o.round !== null ? roundSummary(record, o) : null)} /></div> : null}
                </li>
              );
            })}
          </ol>
        </section>
      ))}
    </div>
  );
}

// A weld step's sign-offs each belong to a round: the welder's closes the round's passes, the inspector's
// is that round's visual inspection, accepted or rejected (the welds tab has the details).
function roundSummary(record: JobRecord, o: JobRecord["steps"][number]["signOffs"][number]) {
  if (o.meaning !== "inspected") return `Round ${o.round}: the welder signed the round's passes.`;
  const i = record.inspections.find((x) => x.signOffId === o.id);
  if (!i) return `Round ${o.round}.`;
  return (
    <span className="flex flex-wrap items-center gap-2">
      Round {o.round} visual inspection:
      <StatusBadge tone={i.decision === "accepted" ? "pass" : "fail"}>{i.decision === "accepted" ? "Accepted" : "Rejected"}</StatusBadge>
      <Link href={`/jobs/${record.job.id}?tab=welds`} className="underline underline-offset-2">details on the Welds tab</Link>
    </span>
  );
}

function MeasurementsTab({ record, system }: { record: JobRecord; system: "metric" | "imperial" }) {
  const rows = record.steps.filter((s) => s.kind === "measure" || s.kind === "torque" || s.kind === "coating");
  // Before from the first geometry step that holds one, after from the last (as the traveller prints them).
  const geoSteps = [...record.steps].sort((a, b) => a.position - b.position).filter((s) => s.kind === "geometry");
  const pick = (w: "before" | "after") => {
    const list = w === "before" ? geoSteps : [...geoSteps].reverse();
    for (const s of list) {
      const c = (s.effectiveValue as GeometryValue | null)?.[w];
      if (c?.results && c.input) return { step: s, capture: c };
    }
    return null;
  };
  const before = pick("before");
  const after = pick("after");
  const wheel = [before, after].every((x) => !x || x.capture.input.steeringRatio !== undefined);
  const scaled = (c: GeometryCapture): GeometryCapture["results"] =>
    wheel && c.input.steeringRatio !== undefined ? { ...c.results, curve: c.results.curve.map(([t, w]) => [t, w * c.input.steeringRatio!] as [number, number]) } : c.results;
  const lenUnit = defaultPadUnit("length", system);
  const pt = (p: { y: number; z: number }) => `${show("length", p.y, lenUnit)} / ${show("length", p.z, lenUnit)}`;
  const geoRows: { key: string; label: string; get: (c: GeometryCapture) => string }[] = [
    { key: "lateral-axle-end", label: "Lateral link, axle end (y / z)", get: (c) => pt(c.input.trackBar.axleEnd) },
    { key: "lateral-frame-end", label: "Lateral link, frame end (y / z)", get: (c) => pt(c.input.trackBar.frameEnd) },
    { key: "lateral", label: "Lateral link angle", get: (c) => `${c.results.trackBarAngleDeg.toFixed(2)}°` },
    { key: "drag", label: "Drag link angle", get: (c) => `${c.results.dragLinkAngleDeg.toFixed(2)}°` },
    { key: "difference", label: "Difference", get: (c) => `${c.results.angleDifferenceDeg.toFixed(2)}°` },
    { key: "worst", label: "Worst bump steer (road wheel)", get: (c) => `${c.results.worstHeave.wheelSteerDeg.toFixed(2)}° at ${show("length", c.results.worstHeave.travel, lenUnit)}` },
    { key: "wheel", label: "Worst at the steering wheel", get: (c) => { const w = worstSteeringWheelDeg(c); return w === null ? "no ratio given" : `${w.toFixed(1)}°`; } },
  ];
  return (
    <div className="space-y-6">
      <section className="card overflow-x-auto" aria-labelledby="meas-h">
        <h3 id="meas-h" className="px-4 pt-3 font-bold">Measurements, torque and coating</h3>
        <table className="mt-2 w-full text-left" data-testid="measurements-table">
          <thead className="bg-graphite-100 text-sm"><tr><th className="px-3 py-1">Step</th><th className="px-3 py-1">Limits</th><th className="px-3 py-1">Recorded</th><th className="px-3 py-1">State</th></tr></thead>
          <tbody>
            {rows.map((s) => {
              const spec = s.spec;
              const limits =
                spec.kind === "measure"
                  ? (() => {
                      const b = measureBounds(spec);
                      const u = defaultPadUnit(spec.quantity as PadQuantity, system);
                      return [b.low !== null ? `≥ ${show(spec.quantity as PadQuantity, b.low, u)}` : null, b.high !== null ? `≤ ${show(spec.quantity as PadQuantity, b.high, u)}` : null].filter(Boolean).join(", ");
                    })()
                  : spec.kind === "torque"
                    ? (() => {
                        const b = torqueBounds(spec);
                        const u = defaultPadUnit("torque", system);
                        return `${show("torque", b.low!, u)} – ${show("torque", b.high!, u)}`;
                      })()
                    : spec.kind === "coating"
                      ? `DFT ${show("thickness", spec.dftMinUm, defaultPadUnit("thickness", system))} – ${show("thickness", spec.dftMaxUm, defaultPadUnit("thickness", system))}, ${spec.dewPointMarginC} °C over dew point`
                      : "";
              return (
                <tr key={s.id} className="border-t border-graphite-100 align-top">
                  <td className="px-3 py-2 font-semibold">{s.title}</td>
                  <td className="figures px-3 py-2 text-sm">{limits}</td>
                  <td className="px-3 py-2">{valueSummary(s.spec, s.effectiveValue, system)}</td>
                  <td className="px-3 py-2">
                    {s.readiness.verdict === "fail" ? <StatusBadge tone="fail">Out of tolerance</StatusBadge> : s.signed ? <StatusBadge tone="pass">Signed</StatusBadge> : <StatusBadge tone="idle">Open</StatusBadge>}
                  </td>
                </tr>
              );
            })}
            {rows.length === 0 ? <tr><td colSpan={4} className="px-3 py-4 text-graphite-700">No measurements on this checklist.</td></tr> : null}
          </tbody>
        </table>
      </section>
      <section className="space-y-3" aria-labelledby="geo-h">
        <h3 id="geo-h" className="font-bold">Steering geometry: before and after</h3>
        {before || after ? (
          <>
            <div className="card overflow-x-auto">
              <table className="w-full text-left" data-testid="geometry-table">
                <thead className="bg-graphite-100 text-sm">
                  <tr>
                    <th scope="col" className="px-3 py-1">Figure</th>
                    <th scope="col" className="px-3 py-1 text-right">Before{before ? ` · ${before.step.title}` : ""}</th>
                    <th scope="col" className="px-3 py-1 text-right">After{after ? ` · ${after.step.title}` : ""}</th>
                  </tr>
                </thead>
                <tbody className="figures">
                  {geoRows.map((r) => (
                    <tr key={r.label} className="border-t border-graphite-100">
                      <th scope="row" className="px-3 py-2 text-left font-sans font-semibold">{r.label}</th>
                      <td className="px-3 py-2 text-right" data-testid={`geo-before-${r.key}`}>{before ? r.get(before.capture) : "not captured yet"}</td>
                      <td className="px-3 py-2 text-right" data-testid={`geo-after-${r.key}`}>{after ? r.get(after.capture) : "not captured yet"}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            <GeometryChart
              wheel={wheel}
              series={[before ? { label: "before", results: scaled(before.capture) } : null, after ? { label: "after", results: scaled(after.capture) } : null].filter((x): x is { label: string; results: GeometryCapture["results"] } => x !== null)}
            />
            <p className="card p-4 text-sm" data-testid="road-test-note">{roadTestNote(before?.capture ?? null, after?.capture ?? null)}</p>
          </>
        ) : (
          <p className="card p-4">No geometry captured yet.</p>
        )}
        <SafetyNote />
      </section>
    </div>
  );
}

function PhotosTab({ record }: { record: JobRecord }) {
  const photos = record.photos.filter((p) => !p.removed);
  if (!photos.length) return <p className="card p-4">No photos yet.</p>;
  const stepTitle = new Map(record.steps.map((s) => [s.id, s.title]));
  return (
    <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-5" data-testid="photo-grid">
      {photos.map((p) => (
        <li key={p.id} className="card overflow-hidden">
          <a href={p.url} target="_blank" rel="noreferrer">
            {/* eslint-disable-next-line @next/next/no-img-element -- served by the photos API to members of the shop only */}
            <img src={p.thumbUrl} alt={`Photo for ${p.stepId ? stepTitle.get(p.stepId) : "the job"}`} className="aspect-square w-full object-cover" />
          </a>
          <div className="p-2 text-sm">
            <p className="font-semibold">{p.stepId ? stepTitle.get(p.stepId) : "Job photo"}{p.nonconformanceId ? " · NC evidence" : ""}</p>
            <p className="text-graphite-700">{p.uploadedBy.name} · {fmt(p.uploadedAt)}</p>
            <p className="figures break-all text-xs text-graphite-700" title="SHA-256 of the stored image">{p.sha256.slice(0, 16)}…</p>
          </div>
        </li>
      ))}
    </ul>
  );
}

async function ActivityTab({ shopId, jobId, page }: { shopId: string; jobId: string; page: number }) {
  const pageSize = 50;
  const { rows, total } = await jobActivityPage(shopId, jobId, page, pageSize);
  const pages = Math.max(1, Math.ceil(total / pageSize));
  return (
    <section className="card p-4" data-testid="activity">
      <ol className="divide-y divide-graphite-100">
        {rows.map((a) => (
          <li key={a.id} className="flex flex-wrap justify-between gap-2 py-2">
            <span><strong>{a.actorName ?? "Gusset"}</strong> {describeJobActivity(a.action, a.detail, a.stepTitle)}</span>
            <time className="figures text-sm text-graphite-700" dateTime={a.at}>{a.at.slice(0, 19).replace("T", " ")} UTC</time>
          </li>
        ))}
      </ol>
      <nav aria-label="Activity pages" className="mt-2 flex items-center gap-2 text-sm">
        {page > 1 ? <Link className="btn btn-quiet" href={`/jobs/${jobId}?tab=activity&page=${page - 1}`}>← Newer</Link> : null}
        <span className="figures">Page {page} of {pages} · {total} entries</span>
        {page < pages ? <Link className="btn btn-quiet" href={`/jobs/${jobId}?tab=activity&page=${page + 1}`}>Older →</Link> : null}
      </nav>
    </section>
  );
}
