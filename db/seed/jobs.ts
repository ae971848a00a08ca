// Demo jobs for a shop, on the starter procedures the procedures seed published: one planned, one in
// progress with signed steps, one waiting at its final hold point, one on hold for an open nonconformance,
// and a planned start-to-finish job. Customers, vehicles, VINs (valid check digits) and tags are invented.
// Idempotent: a job whose axle tag the shop already has is left alone. Signed steps are built with the same
// content and hash functions the API uses, so their hashes verify like any other.
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import * as schema from "@/db/schema";
import { geometryResults } from "@/lib/jobs/geometry";
import { releaseContent } from "@/lib/jobs/content";
import { stepContentHash } from "@/lib/jobs/hash";
import { formatJobNumber } from "@/lib/jobs/number";
import { meaningOf } from "@/lib/jobs/roles";
import { deriveJobState } from "@/lib/jobs/state";
import { vinForJob } from "@/lib/jobs/vin";
import { versionContentSchema, type Step } from "@/lib/procedures/schema";
import { recordEntryFor } from "@/lib/records/entry";
import { chainHash, contentHash, GENESIS_HASH } from "@/lib/seal";
import { vinCheckDigit } from "@/lib/vin";
import { heatInput } from "@/lib/welding";

type SeedDb = NodePgDatabase<typeof schema> | Parameters<Parameters<NodePgDatabase<typeof schema>["transaction"]>[0]>[0];
type Person = { email: string; name: string; roles: readonly string[] };

const { job, jobActivity, jobAssignment, jobCounter, jobStep, nonconformance, procedure, procedureVersion, recordEntry, signOff, user, weldPass } = schema;
const DAY = 86_400_000;

/** An invented VIN with its 49 CFR 565.15 check digit put in position 9. */
function vin(body: string): string {
  const digit = vinCheckDigit(body);
  if (!digit) throw new Error(`not a VIN body: ${body}`);
  return `${body.slice(0, 8)}${digit}${body.slice(9)}`;
}

const GEOMETRY_AFTER = {
  input: {
    trackBar: { frameEnd: { y: -420, z: 250 }, axleEnd: { y: 480, z: 180 } },
    dragLink: { pitmanEnd: { y: -380, z: 265 }, knuckleEnd: { y: 560, z: 190 } },
    axleCenter: { y: 0, z: 0 },
    steeringArmLength: 220,
    steeringRatio: 16,
    travel: { bump: 80, droop: 100, step: 5 },
  },
  unit: "mm" as const,
};

// A value that passes each step kind, for the steps a demo job has already signed.
function passingValue(spec: Step): Record<string, unknown> {
  switch (spec.kind) {
    case "check":
      return { confirmed: true };
    case "caution":
      return { acknowledged: [...spec.hazards] };
    case "measure": {
      const t = spec.tolerance;
      const reading =
        t.type === "plusMinus" ? (spec.nominal ?? 0) + t.plus / 4 : t.type === "range" ? (t.min + t.max) / 2 : t.type === "min" ? t.min * 1.1 + 0.5 : t.max * 0.6;
      return { reading: Math.round(reading * 100) / 100, unit: spec.quantity === "temperature" ? "degC" : undefined };
    }
    case "torque":
      return { achievedNm: Math.round(spec.torqueNm * 100) / 100, unit: spec.torqueUnit ?? "N_m" };
    case "geometry":
      return { [spec.capture === "before" ? "before" : "after"]: { ...GEOMETRY_AFTER, capturedAt: new Date().toISOString(), results: geometryResults(GEOMETRY_AFTER.input) } };
    default:
      return {};
  }
}

type Plan = {
  tag: string;
  procedureTitle: string;
  customer: { name: string; phone: string; email: string };
  vehicle: { year: number; makeModel: string; vin: string };
  axle: string;
  dueInDays: number;
  createdDaysAgo: number;
  notes: string;
  /** steps to sign, in order, by step key; "until:<key>" signs every step before that key; "all" every step */
  sign?: { until: string } | { keys: string[] } | { all: true };
  /** released by the lead once every step is signed */
  release?: boolean;
  nc?: { stepKey: string; value: Record<string, unknown>; description: string; proposed: "rework" | "repair" | "use_as_is" | "scrap" };
};

const PLANS: Plan[] = [
  {
    tag: "AX-0318",
    procedureTitle: "Fitting and welding a weld-in lateral-link bracket at ride height",
    customer: { name: "Mulga Flat Rural Supplies", phone: "+61 8 5550 0318", email: "delivery@mulgaflat.example" },
    vehicle: { year: 2012, makeModel: "mid-size pickup, single cab", vin: vin("ZZGMP22K?CK700318") },
    axle: "Front solid axle housing, lateral link bracket",
    dueInDays: -4,
    createdDaysAgo: 9,
    notes: "Released: every joint accepted at its hold point.",
    sign: { all: true },
    release: true,
  },
  {
    tag: "AX-1103",
    procedureTitle: "Fitting and welding a weld-in lateral-link bracket at ride height",
    customer: { name: "Harlan Creek Station", phone: "+61 8 5550 1103", email: "workshop@harlancreek.example" },
    vehicle: { year: 2011, makeModel: "mid-size pickup, dual cab", vin: vin("ZZGMP41D?BK501103") },
    axle: "Front solid axle housing, passenger-side tube",
    dueInDays: 5,
    createdDaysAgo: 1,
    notes: "Lift of 50 mm; customer wants the old bracket kept for the insurer.",
  },
  {
    tag: "AX-0987",
    procedureTitle: "Preparing an axle tube for welding",
    customer: { name: "Coolabah Fencing Co.", phone: "+61 8 5550 0987", email: "fleet@coolabahfencing.example" },
    vehicle: { year: 2016, makeModel: "full-size wagon, diesel", vin: vin("ZZGFW78T?GR200987") },
    axle: "Front solid axle housing, driver-side tube",
    dueInDays: 2,
    createdDaysAgo: 3,
    notes: "",
    sign: { until: "prep-strip" },
  },
  {
    tag: "AX-0412",
    procedureTitle: "Reassembly, torque, geometry check and road test",
    customer: { name: "Banksia Ridge Tours", phone: "+61 8 5550 0412", email: "ops@banksiaridge.example" },
    vehicle: { year: 2008, makeModel: "short-wheelbase 4x4 wagon", vin: vin("ZZGSW24K?8P300412") },
    axle: "Front solid axle housing, lateral link mount",
    dueInDays: 0,
    createdDaysAgo: 6,
    notes: "Tour vehicle: road test on the gravel loop, not the highway.",
    sign: { until: "fin-hold-final" },
  },
  {
    tag: "AX-0755",
    procedureTitle: "Coating the repaired area",
    customer: { name: "Dry Lake Salvage", phone: "+61 8 5550 0755", email: "yard@drylakesalvage.example" },
    vehicle: { year: 2013, makeModel: "cab-chassis utility", vin: vin("ZZGCC63L?DT400755") },
    axle: "Rear axle housing, new lateral link bracket",
    dueInDays: 1,
    createdDaysAgo: 2,
    notes: "",
    sign: { until: "coat-surface-temperature" },
    nc: {
      stepKey: "coat-surface-temperature",
      value: { reading: 7.5, unit: "degC" },
      description: "Surface at 7.5 °C, below the 10 °C minimum for the primer. Bay heater is out; propose to warm the part and measure again.",
      proposed: "rework",
    },
  },
  {
    tag: "AX-1311",
    procedureTitle: "Lateral-link bracket replacement, start to finish",
    customer: { name: "Gibber Plains Pastoral", phone: "+61 8 5550 1311", email: "vehicles@gibberplains.example" },
    vehicle: { year: 2019, makeModel: "heavy-duty cab-chassis", vin: vin("ZZGHD95M?KX601311") },
    axle: "Front solid axle housing, both tubes",
    dueInDays: 12,
    createdDaysAgo: 0,
    notes: "Customer asks for photos of the old bracket before it is cut off.",
  },
];

async function seedPass(db: SeedDb, p: { shopId: string; jobId: string; stepId: string; welderId: string; process: string; preheatC: number; at: Date }) {
  const volts = 21.5, amps = 165, travel = 280;
  const hi = heatInput({ process: p.process as never, volts, amps, travelSpeed: { value: travel, unit: "mm/min" } });
  const pass = { passNumber: 1, welderId: p.welderId, process: p.process, volts, amps, travelSpeedMmPerMin: travel, preheatC: p.preheatC, interpassC: null, fillerLot: "ER70S-6 LOT 24-118", heatInputKJPerMm: hi.heatInputKJPerMm };
  await db.insert(weldPass).values({
    shopId: p.shopId,
    jobId: p.jobId,
    stepId: p.stepId,
    passNumber: 1,
    welderId: p.welderId,
    process: p.process,
    volts,
    amps,
    travelSpeedMmPerMin: travel,
    travelSpeedUnit: "mm/min",
    preheatC: p.preheatC,
    interpassC: null,
    fillerLot: pass.fillerLot,
    arcEnergyKJPerMm: hi.arcEnergyKJPerMm,
    heatInputKJPerMm: hi.heatInputKJPerMm,
    clientKey: `seed-${p.stepId}-1`,
    recordedAt: p.at,
  });
  return pass;
}

export async function seedJobs(db: SeedDb, shopId: string, people: readonly Person[]): Promise<string[]> {
  const created: string[] = [];
  const users = await db
    .select({ id: user.id, email: user.email, name: user.name })
    .from(user)
    .where(inArray(user.email, people.map((p) => p.email)));
  const find = (role: string, nth = 0) => {
    const p = people.filter((x) => x.roles.includes(role))[nth];
    return p ? users.find((u) => u.email === p.email) : undefined;
  };
  const lead = find("lead");
  const welder = people.find((p) => p.roles.length === 1 && p.roles[0] === "welder") ?? people.find((p) => p.roles.includes("welder"));
  const welderUser = users.find((u) => u.email === welder?.email);
  const inspector = people.find((p) => p.roles.length === 1 && p.roles[0] === "inspector") ?? people.find((p) => p.roles.includes("inspector"));
  const inspectorUser = users.find((u) => u.email === inspector?.email);
  if (!lead || !welderUser || !inspectorUser) return created;
  const now = Date.now();

  for (const plan of PLANS) {
    const [exists] = await db.select({ id: job.id }).from(job).where(and(eq(job.shopId, shopId), eq(job.axleTag, plan.tag)));
    if (exists) continue;
    const [version] = await db
      .select({ id: procedureVersion.id, procedureId: procedureVersion.procedureId, number: procedureVersion.number, content: procedureVersion.content })
      .from(procedureVersion)
      .innerJoin(procedure, eq(procedure.id, procedureVersion.procedureId))
      .where(and(eq(procedureVersion.shopId, shopId), eq(procedureVersion.status, "published"), eq(procedure.title, plan.procedureTitle)))
      .orderBy(desc(procedureVersion.number))
      .limit(1);
    if (!version) continue;
    const content = versionContentSchema.parse(version.content);
    const steps = content.sections.flatMap((section, si) => section.steps.map((step) => ({ section, si, step })));
    const createdAt = new Date(now - plan.createdDaysAgo * DAY - 3 * 3_600_000);
    const year = createdAt.getUTCFullYear();
    const [counter] = await db
      .insert(jobCounter)
      .values({ shopId, year, last: 1 })
      .onConflictDoUpdate({ target: [jobCounter.shopId, jobCounter.year], set: { last: sql`${jobCounter.last} + 1` } })
      .returning({ last: jobCounter.last });
    const number = formatJobNumber(year, counter!.last);
    const v = vinForJob(plan.vehicle.vin);
    const [row] = await db
      .insert(job)
      .values({
        shopId,
        number,
        year,
        seq: counter!.last,
        customerName: plan.customer.name,
        customerPhone: plan.customer.phone,
        customerEmail: plan.customer.email,
        vehicleYear: plan.vehicle.year,
        vehicleMakeModel: plan.vehicle.makeModel,
        vin: v.vin,
        vinWarning: v.warning,
        axleDescription: plan.axle,
        axleTag: plan.tag,
        procedureId: version.procedureId,
        procedureVersionId: version.id,
        procedureVersionNumber: version.number,
        procedureTitle: plan.procedureTitle,
        dueDate: new Date(now + plan.dueInDays * DAY).toISOString().slice(0, 10),
        notes: plan.notes,
        stepsTotal: steps.length,
        createdBy: lead.id,
        createdAt,
        updatedAt: createdAt,
      })
      .returning({ id: job.id });
    const jobId = row!.id;
    const stepRows = await db
      .insert(jobStep)
      .values(
        steps.map(({ section, si, step }, i) => ({
          shopId,
          jobId,
          position: i + 1,
          sectionKey: section.key,
          sectionTitle: section.title,
          sectionPosition: si + 1,
          stepKey: step.key,
          kind: step.kind,
          title: step.title,
          spec: step,
        })),
      )
      .returning({ id: jobStep.id, key: jobStep.stepKey });
    await db.insert(jobAssignment).values([
      { jobId, shopId, userId: welderUser.id, role: "welder" },
      { jobId, shopId, userId: inspectorUser.id, role: "inspector" },
    ]);
    await db.insert(jobActivity).values({ shopId, jobId, actorId: lead.id, action: "job.created", detail: { number, procedure: plan.procedureTitle, version: version.number, steps: steps.length, vinWarning: null }, at: createdAt });

    // Sign the planned steps in order, an hour of work apart.
    const toSign = !plan.sign
      ? []
      : "all" in plan.sign
        ? steps.map((s) => s.step.key)
        : "keys" in plan.sign
        ? plan.sign.keys
        : steps.slice(0, steps.findIndex((s) => s.step.key === (plan.sign as { until: string }).until)).map((s) => s.step.key);
    let at = createdAt.getTime() + 3_600_000;
    // The record chain, as db/queries/records.ts appendToChain builds it for sign-offs made in the app.
    let prevHash = GENESIS_HASH;
    let seq = 0;
    for (const key of toSign) {
      const { step } = steps.find((s) => s.step.key === key)!;
      const stepId = stepRows.find((r) => r.key === key)!.id;
      const signer = step.signedBy === "lead" ? lead : step.kind === "hold" || step.signedBy === "inspector" ? inspectorUser : welderUser;
      const meaning = meaningOf(step);
      const role = meaning === "inspected" ? "inspector" : step.signedBy === "lead" ? "lead" : "welder";
      const value = passingValue(step);
      const signedAt = new Date(Math.min(at, now - 60_000));
      // A weld joint is signed over its passes: one pass inside the usual short-circuit GMAW window.
      const passes = step.kind === "weld" ? [await seedPass(db, { shopId, jobId, stepId, welderId: welderUser.id, process: step.process, preheatC: Math.max(step.minPreheatC, 18), at: new Date(signedAt.getTime() - 600_000) })] : [];
      const { content, hash } = stepContentHash({ jobId, jobNumber: number, stepId, stepKey: key, kind: step.kind, specHash: contentHash(step), meaning, value, photos: [], passes, acceptedUnder: [] });
      await db.update(jobStep).set({ value, version: 2, updatedBy: signer.id, updatedAt: signedAt, signedAt }).where(and(eq(jobStep.id, stepId), eq(jobStep.jobId, jobId)));
      const [so] = await db
        .insert(signOff)
        .values({ shopId, jobId, stepId, userId: signer.id, printedName: signer.name, role, meaning, signedAt, content, contentHash: hash })
        .returning({ id: signOff.id, signedAt: signOff.signedAt });
      const entry = recordEntryFor({ id: so!.id, jobId, stepId, nonconformanceId: null, userId: signer.id, printedName: signer.name, role, meaning, signedAt: so!.signedAt, contentHash: hash, amendsSignOffId: null, reason: null });
      const chained = chainHash(prevHash, entry);
      seq += 1;
      await db.insert(recordEntry).values({ shopId, jobId, seq, signOffId: so!.id, prevHash, hash: chained });
      prevHash = chained;
      await db.insert(jobActivity).values([
        { shopId, jobId, actorId: signer.id, action: "step.value_saved", stepId, detail: { version: 1, value }, at: signedAt },
        { shopId, jobId, actorId: signer.id, action: "step.signed", stepId, detail: { signOffId: so!.id, meaning, role, contentHash: hash, acceptedUnder: [] }, at: signedAt },
      ]);
      at += 3_600_000;
    }
    if (plan.nc) {
      const stepId = stepRows.find((r) => r.key === plan.nc!.stepKey)!.id;
      const raisedAt = new Date(Math.min(at, now - 30_000));
      await db.update(jobStep).set({ value: plan.nc.value, version: 1, updatedBy: welderUser.id, updatedAt: raisedAt }).where(and(eq(jobStep.id, stepId), eq(jobStep.jobId, jobId)));
      await db.insert(nonconformance).values({ shopId, jobId, stepId, number: 1, description: plan.nc.description, proposedDisposition: plan.nc.proposed, observed: plan.nc.value, raisedBy: welderUser.id, raisedAt });
      await db.insert(jobActivity).values({ shopId, jobId, actorId: welderUser.id, action: "nc.raised", stepId, detail: { number: 1, proposed: plan.nc.proposed, description: plan.nc.description, photos: 0 }, at: raisedAt });
    }
    if (plan.release) {
      const signedRows = await db.select({ stepId: signOff.stepId, contentHash: signOff.contentHash }).from(signOff).where(eq(signOff.jobId, jobId));
      const content = releaseContent({
        job: { id: jobId, number },
        procedure: { versionId: version.id, number: version.number },
        steps: steps.map(({ step }) => ({ key: step.key, signOff: signedRows.find((r) => r.stepId === stepRows.find((x) => x.key === step.key)!.id)?.contentHash ?? null })),
        nonconformances: [],
      });
      const hash = contentHash(content);
      const releasedAt = new Date(Math.min(at, now - 30_000));
      const [so] = await db
        .insert(signOff)
        .values({ shopId, jobId, userId: lead.id, printedName: lead.name, role: "lead", meaning: "released", signedAt: releasedAt, content, contentHash: hash })
        .returning({ id: signOff.id, signedAt: signOff.signedAt });
      const entry = recordEntryFor({ id: so!.id, jobId, stepId: null, nonconformanceId: null, userId: lead.id, printedName: lead.name, role: "lead", meaning: "released", signedAt: so!.signedAt, contentHash: hash, amendsSignOffId: null, reason: null });
      const chained = chainHash(prevHash, entry);
      seq += 1;
      await db.insert(recordEntry).values({ shopId, jobId, seq, signOffId: so!.id, prevHash, hash: chained });
      prevHash = chained;
      await db.insert(jobActivity).values({ shopId, jobId, actorId: lead.id, action: "job.released", detail: { signOffId: so!.id, from: "ready_for_release" }, at: releasedAt });
    }
    const signedKeys = new Set(toSign);
    const status = deriveJobState({
      status: "planned",
      steps: steps.map(({ step }, i) => ({ id: step.key, key: step.key, title: step.title, kind: step.kind, position: i + 1, sectionKey: "", signed: signedKeys.has(step.key) })),
      openNonconformances: plan.nc ? 1 : 0,
    });
    const released = plan.release ? { status: "released" as const, releasedAt: new Date(Math.min(at, now - 30_000)), releasedBy: lead.id } : { status };
    await db
      .update(job)
      .set({ ...released, stepsSigned: signedKeys.size, openNonconformances: plan.nc ? 1 : 0, startedAt: signedKeys.size ? new Date(createdAt.getTime() + 3_600_000) : null, updatedAt: new Date(Math.min(at, now)) })
      .where(and(eq(job.id, jobId), eq(job.shopId, shopId)));
    if (status !== "planned") {
      await db.insert(jobActivity).values({ shopId, jobId, actorId: null, action: "job.state", detail: { from: "planned", to: status }, at: new Date(Math.min(at, now)) });
    }
    created.push(`job ${number} (${released.status})`);
  }
  return created;
}
