// Demo jobs for a shop, on the starter procedures the procedures seed published: one planned, one in
// progress with signed steps, one waiting at its final hold point, one on hold for an open nonconformance,
// and a planned start-to-finish job. Customers, vehicles, VINs (valid check digits) and tags are invented.
// Idempotent: a job whose axle tag the shop already has is left alone. Signed steps are built with the same
// content and hash functions the API uses, so their hashes verify like any other.
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import * as schema from "@/db/schema";
import { geometryResults } from "@/lib/jobs/geometry";
import { inspectionContent, releaseContent, type SignedPass } from "@/lib/jobs/content";
import { stepContentHash } from "@/lib/jobs/hash";
import { formatJobNumber } from "@/lib/jobs/number";
import { materialsInUse } from "@/lib/jobs/materials";
import { photosNeeded } from "@/lib/jobs/readiness";
import { meaningOf } from "@/lib/jobs/roles";
import { deriveJobState } from "@/lib/jobs/state";
import { vinForJob } from "@/lib/jobs/vin";
import { versionContentSchema, type Step } from "@/lib/procedures/schema";
import { jobMapFromProcedure, sealedWeldMap } from "@/lib/weld-map";
import { recordEntryFor } from "@/lib/records/entry";
import { chainHash, contentHash, GENESIS_HASH } from "@/lib/seal";
import { vinCheckDigit } from "@/lib/vin";
import { checkPassAgainstWps, heatInput, judgeVisual, type VisualObservations, type WpsRanges } from "@/lib/welding";
import { toWpsRanges } from "@/lib/welding/wps-schema";
import type { SeedPhotoStore } from "./photos";

type SeedDb = NodePgDatabase<typeof schema> | Parameters<Parameters<NodePgDatabase<typeof schema>["transaction"]>[0]>[0];
type Person = { email: string; name: string; roles: readonly string[] };

const { job, jobActivity, jobAssignment, jobCounter, jobMaterial, jobStep, nonconformance, photo, procedure, procedureVersion, recordEntry, signOff, user, weldInspection, weldPass, welderProcessUse, wps, wpsRevision } = schema;
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

// The same truck before the work: the old bracket held the lateral link's axle end 60 mm lower.
const GEOMETRY_BEFORE = {
  ...GEOMETRY_AFTER,
  input: { ...GEOMETRY_AFTER.input, trackBar: { ...GEOMETRY_AFTER.input.trackBar, axleEnd: { y: 480, z: 120 } } },
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
      if (spec.capture === "before") return { before: { ...GEOMETRY_BEFORE, capturedAt: new Date().toISOString(), results: geometryResults(GEOMETRY_BEFORE.input) } };
      if (spec.capture === "after") return { after: { ...GEOMETRY_AFTER, capturedAt: new Date().toISOString(), results: geometryResults(GEOMETRY_AFTER.input) } };
      return {
        before: { ...GEOMETRY_BEFORE, capturedAt: new Date().toISOString(), results: geometryResults(GEOMETRY_BEFORE.input) },
        after: { ...GEOMETRY_AFTER, capturedAt: new Date().toISOString(), results: geometryResults(GEOMETRY_AFTER.input) },
      };
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
  /** a weld joint rejected at its first inspection (undercut), repaired in round 2 and accepted */
  repair?: { stepKey: string; undercutDepthMm: number; notes: string };
  /** weld joints worked on but not accepted: one signed round waiting for the inspector, or one rejected */
  openJoints?: { stepKey: string; state: "awaiting_inspection" | "repair" }[];
  materials?: { kind: "base" | "filler" | "other"; description: string; specification: string; heatNumber: string; certificate: string }[];
};

const BRACKET_MATERIALS: NonNullable<Plan["materials"]> = [
  { kind: "base", description: "Lateral-link bracket plate, 10 mm", specification: "Hot-rolled carbon steel plate, 250 MPa grade", heatNumber: "HT 7731-0412", certificate: "MC-24-0871" },
  { kind: "filler", description: "Solid wire 0.9 mm, 15 kg spool", specification: "ER70S-6", heatNumber: "LOT 24-118", certificate: "CoC 24-118" },
];

const PLANS: Plan[] = [
  {
    tag: "AX-0318",
    procedureTitle: "Fitting and welding a weld-in lateral-link bracket at ride height",
    customer: { name: "Mulga Flat Rural Supplies", phone: "+61 8 5550 0318", email: "delivery@mulgaflat.example" },
    vehicle: { year: 2012, makeModel: "mid-size pickup, single cab", vin: vin("ZZGMP22K?CK700318") },
    axle: "Front solid axle housing, lateral link bracket",
    dueInDays: -4,
    createdDaysAgo: 9,
    notes: "Released: every joint accepted at its first inspection.",
    sign: { all: true },
    release: true,
    materials: BRACKET_MATERIALS,
  },
  {
    tag: "AX-0533",
    procedureTitle: "Fitting and welding a weld-in lateral-link bracket at ride height",
    customer: { name: "Quandong Well Contracting", phone: "+61 8 5550 0533", email: "plant@quandongwell.example" },
    vehicle: { year: 2014, makeModel: "mid-size pickup, extra cab", vin: vin("ZZGMP33E?EK900533") },
    axle: "Front solid axle housing, lateral link bracket",
    dueInDays: -2,
    createdDaysAgo: 7,
    notes: "Released after a repair: joint W2 was rejected for undercut, ground out, rewelded and accepted.",
    sign: { all: true },
    release: true,
    repair: { stepKey: "fit-weld-w2", undercutDepthMm: 1.2, notes: "Undercut along the upper toe of W2, about 60 mm long. Grind out and reweld the toe." },
    materials: BRACKET_MATERIALS.map((m) => (m.kind === "base" ? { ...m, heatNumber: "HT 7731-0530" } : m)),
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
    tag: "AX-0621",
    procedureTitle: "Fitting and welding a weld-in lateral-link bracket at ride height",
    customer: { name: "Saltbush Plains Grazing", phone: "+61 8 5550 0621", email: "sheds@saltbushplains.example" },
    vehicle: { year: 2010, makeModel: "mid-size pickup, space cab", vin: vin("ZZGMP27F?AK600621") },
    axle: "Front solid axle housing, lateral link bracket",
    dueInDays: 3,
    createdDaysAgo: 2,
    notes: "W2 is signed and waits for the inspector; W3 was sent back for repair.",
    sign: { until: "fit-weld-w2" },
    openJoints: [
      { stepKey: "fit-weld-w2", state: "awaiting_inspection" },
      { stepKey: "fit-weld-w3", state: "repair" },
    ],
    materials: BRACKET_MATERIALS.map((m) => (m.kind === "base" ? { ...m, heatNumber: "HT 7731-0618" } : m)),
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

type SeedWps = { revisionId: string; reference: string; number: number; ranges: WpsRanges; positions: string[] };

// One pass inside the shop's short-circuit GMAW window (the seeded WPS: 17–21 V, 110–165 A, 250–450 mm/min).
async function seedPass(
  db: SeedDb,
  p: { shopId: string; jobId: string; stepId: string; welderId: string; step: Extract<Step, { kind: "weld" }>; wps: SeedWps; passNumber: number; round: number; at: Date; volts?: number; amps?: number; travel?: number },
): Promise<SignedPass> {
  const volts = p.volts ?? 19.5, amps = p.amps ?? 150, travel = p.travel ?? 300;
  const preheatC = Math.max(p.step.minPreheatC, p.wps.ranges.preheatMinC ?? 0, 18);
  const interpassC = p.passNumber > 1 ? 140 : null;
  const hi = heatInput({ process: p.step.process, volts, amps, travelSpeed: { value: travel, unit: "mm/min" } });
  const check = checkPassAgainstWps({ ...p.wps.ranges, positions: p.wps.positions }, { process: p.step.process, volts, amps, travelSpeedMmPerMin: travel, preheatC, ...(interpassC !== null ? { interpassC } : {}), position: p.step.position });
  const fillerLot = "ER70S-6 LOT 24-118";
  await db.insert(weldPass).values({
    shopId: p.shopId,
    jobId: p.jobId,
    stepId: p.stepId,
    passNumber: p.passNumber,
    round: p.round,
    welderId: p.welderId,
    process: p.step.process,
    position: p.step.position,
    fillerClassification: p.step.filler,
    wpsRevisionId: p.wps.revisionId,
    wpsReference: p.wps.reference,
    wpsRevisionNumber: p.wps.number,
    volts,
    amps,
    travelSpeedMmPerMin: travel,
    travelSpeedUnit: "mm/min",
    preheatC,
    interpassC,
    fillerLot,
    arcEnergyKJPerMm: hi.arcEnergyKJPerMm,
    heatInputKJPerMm: hi.heatInputKJPerMm,
    jPerIn: hi.jPerIn,
    wpsFindings: check.findings,
    outOfRange: check.outOfRange || check.incomplete,
    clientKey: `seed-${p.stepId}-${p.passNumber}`,
    recordedAt: p.at,
  });
  // Continuity: the pass is a use of the process (never moves the last use back).
  await db
    .insert(welderProcessUse)
    .values({ shopId: p.shopId, welderUserId: p.welderId, process: p.step.process, lastUsedOn: p.at.toISOString().slice(0, 10) })
    .onConflictDoUpdate({ target: [welderProcessUse.shopId, welderProcessUse.welderUserId, welderProcessUse.process], set: { lastUsedOn: sql`greatest(${welderProcessUse.lastUsedOn}, excluded.last_used_on)` } });
  return {
    passNumber: p.passNumber,
    welderId: p.welderId,
    process: p.step.process,
    volts,
    amps,
    travelSpeedMmPerMin: travel,
    preheatC,
    interpassC,
    fillerLot,
    heatInputKJPerMm: hi.heatInputKJPerMm,
    round: p.round,
    position: p.step.position,
    wps: { reference: p.wps.reference, revision: p.wps.number },
    outOfRange: check.outOfRange || check.incomplete,
    override: null,
  };
}

async function publishedWps(db: SeedDb, shopId: string, reference: string): Promise<SeedWps | null> {
  const [r] = await db
    .select({ revision: wpsRevision, reference: wps.reference })
    .from(wpsRevision)
    .innerJoin(wps, eq(wps.id, wpsRevision.wpsId))
    .where(and(eq(wpsRevision.shopId, shopId), eq(wpsRevision.status, "published"), eq(wps.reference, reference.trim().toUpperCase())));
  if (!r) return null;
  return { revisionId: r.revision.id, reference: r.reference, number: r.revision.number, ranges: toWpsRanges(r.revision as never), positions: [...r.revision.positions] };
}

// What an inspector sees on a sound bracket fillet, and on one with undercut past the AWS D1.1 Table 8.1 limit.
function observationsFor(step: Extract<Step, { kind: "weld" }>, undercutDepthMm: number): VisualObservations {
  return {
    cracks: false,
    fusionComplete: true,
    cratersFilled: true,
    profileAcceptable: true,
    specifiedLegMm: step.sizeMm,
    measuredLegMm: step.sizeMm + 0.5,
    weldLengthMm: step.lengthMm,
    materialThicknessMm: 10,
    undercutDepthMm,
    undercutAccumulatedMm: undercutDepthMm > 0.8 ? 60 : 0,
    porosityMm: 0,
    porosity12Mm: 0,
    arcStrikes: false,
    spatterAcceptable: true,
  };
}

export async function seedJobs(db: SeedDb, shopId: string, people: readonly Person[], photos: SeedPhotoStore | null): Promise<string[]> {
  const created: string[] = [];
  if (!photos) {
    console.warn("[seed] no object store configured (S3_ENDPOINT): demo jobs, which carry photos, are not seeded");
    return created;
  }
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
    const versionContent = versionContentSchema.parse(version.content);
    const content = versionContent;
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
        weldMap: jobMapFromProcedure(content.weldMap),
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
    // Appends one sign-off and its chain entry, as appendSignOff / appendToChain do in the app.
    const append = async (a: { stepId: string | null; signer: { id: string; name: string }; role: string; meaning: "performed" | "inspected" | "released"; signedAt: Date; content: Record<string, unknown>; hash: string; round?: number | null }) => {
      const [so] = await db
        .insert(signOff)
        .values({ shopId, jobId, stepId: a.stepId, userId: a.signer.id, printedName: a.signer.name, role: a.role, meaning: a.meaning, signedAt: a.signedAt, content: a.content, contentHash: a.hash, round: a.round ?? null })
        .returning({ id: signOff.id, signedAt: signOff.signedAt });
      const entry = recordEntryFor({ id: so!.id, jobId, stepId: a.stepId, nonconformanceId: null, userId: a.signer.id, printedName: a.signer.name, role: a.role, meaning: a.meaning, signedAt: so!.signedAt, contentHash: a.hash, amendsSignOffId: null, reason: null, round: a.round ?? null });
      const chained = chainHash(prevHash, entry);
      seq += 1;
      await db.insert(recordEntry).values({ shopId, jobId, seq, signOffId: so!.id, prevHash, hash: chained });
      prevHash = chained;
      return so!;
    };
    const addPhoto = async (a: { stepId: string | null; title: string; lines: string[]; caption: string; by: string; at: Date }) => {
      const idempotencyKey = `seed-${jobId}-${photoCount++}`;
      const stored = await photos!.put({ shopId, jobId, idempotencyKey, title: a.title, lines: a.lines });
      const [row] = await db
        .insert(photo)
        .values({ shopId, jobId, stepId: a.stepId, ...stored, idempotencyKey, caption: a.caption, uploadedBy: a.by, uploadedAt: a.at })
        .returning({ id: photo.id, sha256: photo.sha256 });
      return row!;
    };
    let photoCount = 0;
    const inspect = async (a: { step: Extract<Step, { kind: "weld" }>; stepId: string; key: string; round: number; performedId: string; passes: SignedPass[]; undercutDepthMm: number; notes: string; at: Date }) => {
      const observations = observationsFor(a.step, a.undercutDepthMm);
      const verdict = judgeVisual("aws-d1.1-static", observations);
      const decision = verdict.accepted ? ("accepted" as const) : ("rejected" as const);
      const shot = await addPhoto({ stepId: null, title: `${a.step.jointId} · round ${a.round}`, lines: [number, plan.tag, `Visual inspection: ${decision}`], caption: `${a.step.jointId} round ${a.round} inspection`, by: inspectorUser.id, at: new Date(a.at.getTime() - 120_000) });
      const content = inspectionContent({
        job: { id: jobId, number },
        step: { id: a.stepId, key: a.key, jointId: a.step.jointId, specHash: contentHash(a.step) },
        round: a.round,
        performed: a.performedId,
        passes: a.passes.map((p) => ({ passNumber: p.passNumber, welderId: p.welderId, heatInputKJPerMm: p.heatInputKJPerMm })),
        criteria: "aws-d1.1-static",
        observations: observations as unknown as Record<string, unknown>,
        items: verdict.items,
        judged: verdict.verdict,
        decision,
        notes: a.notes,
        photos: [shot],
      });
      const hash = contentHash(content);
      const so = await append({ stepId: a.stepId, signer: inspectorUser, role: "inspector", meaning: "inspected", signedAt: a.at, content, hash, round: a.round });
      await db.insert(weldInspection).values({ shopId, jobId, stepId: a.stepId, round: a.round, criteria: "aws-d1.1-static", observations, items: verdict.items, judged: verdict.verdict, decision, notes: a.notes, photoIds: [shot.id], inspectorId: inspectorUser.id, signOffId: so.id, inspectedAt: so.signedAt });
      await db.insert(jobActivity).values({ shopId, jobId, actorId: inspectorUser.id, action: decision === "accepted" ? "weld.accepted" : "weld.rejected", stepId: a.stepId, detail: { joint: a.step.jointId, round: a.round, criteria: "aws-d1.1-static", signOffId: so.id, rejected: verdict.rejectedItems, notes: a.notes }, at: a.at });
      return { decision, signOffId: so.id };
    };

    // Joints left open in the demo (waiting for the inspector, or sent back for repair) come after the signed steps.
    for (const key of [...toSign, ...(plan.openJoints ?? []).map((j) => j.stepKey)]) {
      const { step } = steps.find((s) => s.step.key === key)!;
      const stepId = stepRows.find((r) => r.key === key)!.id;
      const signer = step.signedBy === "lead" ? lead : step.kind === "hold" || step.signedBy === "inspector" ? inspectorUser : welderUser;
      const meaning = meaningOf(step);
      const role = meaning === "inspected" ? "inspector" : step.signedBy === "lead" ? "lead" : "welder";
      const value = passingValue(step);
      const signedAt = new Date(Math.min(at, now - 60_000));
      // Steps that ask for photos get them, taken just before signing.
      const stepPhotos = [];
      for (let i = 0; i < photosNeeded(step); i++) {
        stepPhotos.push(await addPhoto({ stepId, title: step.title, lines: [number, plan.tag, `Photo ${i + 1} of ${photosNeeded(step)}`], caption: step.title, by: signer.id, at: new Date(signedAt.getTime() - 300_000 + i * 1000) }));
      }
      await db.update(jobStep).set({ value, version: 2, updatedBy: signer.id, updatedAt: signedAt, signedAt }).where(and(eq(jobStep.id, stepId), eq(jobStep.jobId, jobId)));
      await db.insert(jobActivity).values({ shopId, jobId, actorId: signer.id, action: "step.value_saved", stepId, detail: { version: 1, value }, at: signedAt });
      if (step.kind === "weld") {
        const stepWps = await publishedWps(db, shopId, step.wpsRef);
        if (!stepWps) throw new Error(`seed: joint ${step.jointId} names ${step.wpsRef}, which the shop has not published`);
        // How each round ends: accepted; rejected (then a repair round); or still waiting for the inspector.
        const open = plan.openJoints?.find((j) => j.stepKey === key);
        const repair = plan.repair?.stepKey === key ? plan.repair : null;
        const outcomes: ("accepted" | "rejected" | "pending")[] = open ? [open.state === "awaiting_inspection" ? "pending" : "rejected"] : repair ? ["rejected", "accepted"] : ["accepted"];
        const found = open?.state === "repair" ? { undercutDepthMm: 1.4, notes: "Undercut 1.4 mm deep along the tube-side toe, about 60 mm long. Grind it out and reweld the toe." } : repair;
        let repairOf: string | null = null;
        let when = signedAt.getTime();
        for (const [i, outcome] of outcomes.entries()) {
          const round = i + 1;
          const pass = await seedPass(db, { shopId, jobId, stepId, welderId: welderUser.id, step, wps: stepWps, passNumber: round, round, at: new Date(when - 600_000) });
          const { content, hash } = stepContentHash({ jobId, jobNumber: number, stepId, stepKey: key, kind: step.kind, specHash: contentHash(step), meaning, value, photos: round === 1 ? stepPhotos : [], passes: [pass], acceptedUnder: [], round: { number: round, repairOf } });
          const performed = await append({ stepId, signer: welderUser, role: "welder", meaning: "performed", signedAt: new Date(when), content, hash, round });
          await db.insert(jobActivity).values({ shopId, jobId, actorId: welderUser.id, action: "step.signed", stepId, detail: { signOffId: performed.id, meaning, role: "welder", contentHash: hash, acceptedUnder: [], round }, at: new Date(when) });
          if (outcome === "pending") break;
          const rejectNow = outcome === "rejected" && found !== null;
          const result = await inspect({ step, stepId, key, round, performedId: performed.id, passes: [pass], undercutDepthMm: rejectNow ? found.undercutDepthMm : 0.3, notes: rejectNow ? found.notes : "", at: new Date(Math.min(when + 1_200_000, now - 120_000)) });
          repairOf = result.signOffId;
          when += 3_600_000;
          at += 3_600_000;
        }
        at += 3_600_000;
        continue;
      }
      const { content, hash } = stepContentHash({ jobId, jobNumber: number, stepId, stepKey: key, kind: step.kind, specHash: contentHash(step), meaning, value, photos: stepPhotos, passes: [], acceptedUnder: [] });
      const so = await append({ stepId, signer, role, meaning, signedAt, content, hash });
      await db.insert(jobActivity).values({ shopId, jobId, actorId: signer.id, action: "step.signed", stepId, detail: { signOffId: so.id, meaning, role, contentHash: hash, acceptedUnder: [] }, at: signedAt });
      at += 3_600_000;
    }
    for (const m of plan.materials ?? []) {
      await db.insert(jobMaterial).values({ shopId, jobId, kind: m.kind, description: m.description, specification: m.specification, heatNumber: m.heatNumber, certificate: m.certificate, recordedBy: welderUser.id, recordedAt: new Date(createdAt.getTime() + 1_800_000) });
    }
    if (plan.nc) {
      const stepId = stepRows.find((r) => r.key === plan.nc!.stepKey)!.id;
      const raisedAt = new Date(Math.min(at, now - 30_000));
      await db.update(jobStep).set({ value: plan.nc.value, version: 1, updatedBy: welderUser.id, updatedAt: raisedAt }).where(and(eq(jobStep.id, stepId), eq(jobStep.jobId, jobId)));
      await db.insert(nonconformance).values({ shopId, jobId, stepId, number: 1, description: plan.nc.description, proposedDisposition: plan.nc.proposed, observed: plan.nc.value, raisedBy: welderUser.id, raisedAt });
      await db.insert(jobActivity).values({ shopId, jobId, actorId: welderUser.id, action: "nc.raised", stepId, detail: { number: 1, proposed: plan.nc.proposed, description: plan.nc.description, photos: 0 }, at: raisedAt });
    }
    if (plan.release) {
      // As the app builds it: each step's latest sign-off (a weld's last inspection), and the materials in use.
      const signedRows = await db.select({ stepId: signOff.stepId, contentHash: signOff.contentHash }).from(signOff).where(eq(signOff.jobId, jobId)).orderBy(asc(signOff.signedAt), asc(signOff.id));
      const materials = await db.select().from(jobMaterial).where(eq(jobMaterial.jobId, jobId)).orderBy(asc(jobMaterial.recordedAt), asc(jobMaterial.id));
      const content = releaseContent({
        job: { id: jobId, number },
        procedure: { versionId: version.id, number: version.number },
        steps: steps.map(({ step }) => ({ key: step.key, signOff: signedRows.filter((r) => r.stepId === stepRows.find((x) => x.key === step.key)!.id).at(-1)?.contentHash ?? null })),
        nonconformances: [],
        materials: materialsInUse(materials),
        weldMap: sealedWeldMap(jobMapFromProcedure(versionContent.weldMap)),
      });
      const hash = contentHash(content);
      const releasedAt = new Date(Math.min(at, now - 30_000));
      const so = await append({ stepId: null, signer: lead, role: "lead", meaning: "released", signedAt: releasedAt, content, hash });
      await db.insert(jobActivity).values({ shopId, jobId, actorId: lead.id, action: "job.released", detail: { signOffId: so.id, from: "ready_for_release" }, at: releasedAt });
    }
    const signedKeys = new Set(toSign);
    const status = deriveJobState({
      status: "planned",
      steps: steps.map(({ step }, i) => ({ id: step.key, key: step.key, title: step.title, kind: step.kind, position: i + 1, sectionKey: "", signed: signedKeys.has(step.key) })),
      openNonconformances: plan.nc ? 1 : 0,
      workRecorded: signedKeys.size > 0,
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
