// Demo WPS library and welder qualifications (all invented). Iron Gully: three published WPSs, one with a
// revision history (revision 1 superseded by 2), and qualifications that are current, lapsing within 30 days
// and lapsed, with dates worked out from today. Saltpan: one WPS and one current qualification.
// Idempotent: a WPS whose reference the shop has, or a qualification a welder holds for a process, is left alone.
import { and, eq, inArray } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import * as schema from "@/db/schema";
import { EMPTY_CONTENT, type WpsContent, type WpsProcess } from "@/lib/welding/wps-schema";
import { addDays, addMonthsClamped } from "@/lib/welding/continuity";

type SeedDb = NodePgDatabase<typeof schema> | Parameters<Parameters<NodePgDatabase<typeof schema>["transaction"]>[0]>[0];
type Person = { readonly email: string; readonly roles: readonly string[] };

const { shop, user, wps, wpsRevision, welderQualification, welderProcessUse } = schema;
const DAY = 86_400_000;

type SeedRevision = { content: WpsContent; changeNote: string; publishedDaysAgo: number; retireNote?: string };
type SeedWps = { reference: string; revisions: SeedRevision[] };

const gmaw: WpsContent = {
  ...EMPTY_CONTENT,
  title: "GMAW short-circuit, carbon steel tube to plate, 1F–4F",
  process: "GMAW",
  iso4063: 135,
  baseMetals: "Carbon steel axle tube (DOM, 0.25 % C max) to hot-rolled carbon steel bracket plate",
  thicknessMinMm: 3,
  thicknessMaxMm: 12,
  fillerClassification: "ER70S-6",
  fillerDiameterMm: 0.9,
  shieldingGas: "Argon 75 % / CO₂ 25 %",
  gasFlowLPerMin: 14,
  currentType: "DC",
  polarity: "EP",
  voltsMin: 17,
  voltsMax: 21,
  ampsMin: 110,
  ampsMax: 165,
  travelSpeedMinMmPerMin: 250,
  travelSpeedMaxMmPerMin: 450,
  heatInputMaxKJPerMm: 1.2,
  heatInputBasis: "arc-energy",
  preheatMinC: 10,
  interpassMaxC: 250,
  positions: ["1F", "2F", "3F", "4F"],
  notes: "Short-circuit transfer. Vertical fillets uphill. Grind coatings back 50 mm from the joint before heat.",
};

const gtawV1: WpsContent = {
  ...EMPTY_CONTENT,
  title: "GTAW, chromoly tube to plate, all-position fillets",
  process: "GTAW",
  iso4063: 141,
  baseMetals: "4130 chromoly tube (wall under 3 mm) to 4130 or carbon steel tab",
  thicknessMinMm: 1.5,
  thicknessMaxMm: 6,
  fillerClassification: "ER70S-2",
  fillerDiameterMm: 2.4,
  shieldingGas: "Argon 100 %",
  gasFlowLPerMin: 10,
  currentType: "DC",
  polarity: "EN",
  voltsMin: 10,
  voltsMax: 14,
  ampsMin: 70,
  ampsMax: 140,
  travelSpeedMinMmPerMin: 60,
  travelSpeedMaxMmPerMin: 160,
  heatInputMaxKJPerMm: 1.0,
  heatInputBasis: "arc-energy",
  preheatMinC: 10,
  interpassMaxC: 200,
  positions: ["1F", "2F", "3F", "4F", "5F"],
  notes: "Thin-wall chromoly: no preheat above the minimum; let the joint air cool, never quench.",
};

const gtawV2: WpsContent = {
  ...gtawV1,
  ampsMax: 125,
  preheatMinC: 20,
  notes: "Thin-wall chromoly: warm the joint to at least 20 °C in a cold shop; let it air cool, never quench.",
};

const fcaw: WpsContent = {
  ...EMPTY_CONTENT,
  title: "FCAW gas-shielded, truss plate to axle housing, 1F–2F",
  process: "FCAW",
  iso4063: 136,
  baseMetals: "Carbon steel axle housing tube to carbon steel truss plate",
  thicknessMinMm: 6,
  thicknessMaxMm: 19,
  fillerClassification: "E71T-1C",
  fillerDiameterMm: 1.2,
  shieldingGas: "CO₂ 100 %",
  gasFlowLPerMin: 18,
  currentType: "DC",
  polarity: "EP",
  voltsMin: 22,
  voltsMax: 27,
  ampsMin: 160,
  ampsMax: 240,
  travelSpeedMinMmPerMin: 250,
  travelSpeedMaxMmPerMin: 450,
  heatInputMaxKJPerMm: 1.6,
  heatInputBasis: "arc-energy",
  preheatMinC: 50,
  interpassMaxC: 250,
  positions: ["1F", "2F"],
  notes: "Housing turned so every fillet is flat or horizontal. Stagger stitch welds side to side to limit tube bow.",
};

const smaw: WpsContent = {
  ...EMPTY_CONTENT,
  title: "SMAW low-hydrogen, frame rail gussets, 1F–3F",
  process: "SMAW",
  iso4063: 111,
  baseMetals: "Carbon steel frame rail to carbon steel gusset plate",
  thicknessMinMm: 4,
  thicknessMaxMm: 16,
  fillerClassification: "E7018",
  fillerDiameterMm: 3.2,
  currentType: "DC",
  polarity: "EP",
  voltsMin: 20,
  voltsMax: 26,
  ampsMin: 100,
  ampsMax: 140,
  travelSpeedMinMmPerMin: 100,
  travelSpeedMaxMmPerMin: 250,
  preheatMinC: 10,
  interpassMaxC: 250,
  positions: ["1F", "2F", "3F"],
  notes: "Electrodes from the holding oven; no more than four hours out.",
};

const LIBRARY: Record<string, SeedWps[]> = {
  "iron-gully": [
    { reference: "GUS-GMAW-02", revisions: [{ content: gmaw, changeNote: "First issue.", publishedDaysAgo: 420 }] },
    {
      reference: "GUS-GTAW-01",
      revisions: [
        { content: gtawV1, changeNote: "First issue.", publishedDaysAgo: 500, retireNote: "Superseded by revision 2." },
        { content: gtawV2, changeNote: "Minimum preheat raised to 20 °C for winter; maximum current cut to 125 A after burn-through on 1.6 mm wall.", publishedDaysAgo: 150 },
      ],
    },
    { reference: "GUS-FCAW-01", revisions: [{ content: fcaw, changeNote: "First issue.", publishedDaysAgo: 300 }] },
  ],
  saltpan: [{ reference: "SP-WPS-01", revisions: [{ content: smaw, changeNote: "First issue.", publishedDaysAgo: 200 }] }],
};

type SeedQualification = {
  email: string;
  process: WpsProcess;
  positions: WpsContent["positions"];
  thicknessMinMm: number;
  thicknessMaxMm: number | null;
  diameterMinMm: number | null;
  fillerFNumber: number;
  wpsReference: string | null;
  /** Last use of the process, from today. */
  lastUse: (today: string) => string;
  testDaysBeforeUse: number;
  notes: string;
};

const QUALIFICATIONS: Record<string, SeedQualification[]> = {
  "iron-gully": [
    {
      // Current: used on a job three weeks ago.
      email: "welder@irongully.example",
      process: "GMAW",
      positions: ["1F", "2F", "3F", "4F", "1G", "2G", "3G"],
      thicknessMinMm: 3,
      thicknessMaxMm: 20,
      diameterMinMm: 73,
      fillerFNumber: 6,
      wpsReference: "GUS-GMAW-02",
      lastUse: (today) => addDays(today, -20),
      testDaysBeforeUse: 380,
      notes: "10 mm plate coupon, 3G uphill, bend tested.",
    },
    {
      // Lapsed: FCAW last used a little over seven months ago.
      email: "welder@irongully.example",
      process: "FCAW",
      positions: ["1F", "2F", "1G", "2G"],
      thicknessMinMm: 3,
      thicknessMaxMm: null,
      diameterMinMm: null,
      fillerFNumber: 6,
      wpsReference: "GUS-FCAW-01",
      lastUse: (today) => addDays(addMonthsClamped(today, -7), -10),
      testDaysBeforeUse: 300,
      notes: "25 mm plate coupon, 2G, bend tested.",
    },
    {
      // Lapsing: GTAW last used just under six months ago, so it lapses in about two weeks.
      email: "welder2@irongully.example",
      process: "GTAW",
      positions: ["1F", "2F", "3F", "4F", "5F"],
      thicknessMinMm: 1.5,
      thicknessMaxMm: 8,
      diameterMinMm: 25,
      fillerFNumber: 6,
      wpsReference: "GUS-GTAW-01",
      lastUse: (today) => addDays(addMonthsClamped(today, -6), 12),
      testDaysBeforeUse: 100,
      notes: "Chromoly tube-to-plate fillet coupon, macro-etched.",
    },
  ],
  saltpan: [
    {
      email: "welder@saltpan.example",
      process: "SMAW",
      positions: ["1F", "2F", "3F", "1G", "2G"],
      thicknessMinMm: 5,
      thicknessMaxMm: 20,
      diameterMinMm: null,
      fillerFNumber: 4,
      wpsReference: "SP-WPS-01",
      lastUse: (today) => addDays(today, -9),
      testDaysBeforeUse: 250,
      notes: "12 mm plate coupon, 3G.",
    },
  ],
};

export async function seedWelding(db: SeedDb, shopId: string, people: readonly Person[], now = new Date()): Promise<string[]> {
  const [s] = await db.select({ slug: shop.slug }).from(shop).where(eq(shop.id, shopId));
  const library = s ? LIBRARY[s.slug] : undefined;
  if (!s || !library) return [];
  const emails = people.map((p) => p.email);
  const users = emails.length ? await db.select({ id: user.id, email: user.email }).from(user).where(inArray(user.email, emails)) : [];
  const idOf = new Map(users.map((u) => [u.email, u.id]));
  const leadEmail = people.find((p) => p.roles.includes("lead"))?.email;
  const leadId = leadEmail ? idOf.get(leadEmail) : undefined;
  if (!leadId) return [];
  const created: string[] = [];
  const today = now.toISOString().slice(0, 10);
  const wpsIds = new Map<string, string>();

  for (const w of library) {
    const [existing] = await db.select({ id: wps.id }).from(wps).where(and(eq(wps.shopId, shopId), eq(wps.reference, w.reference)));
    if (existing) {
      wpsIds.set(w.reference, existing.id);
      continue;
    }
    const first = new Date(now.getTime() - w.revisions[0]!.publishedDaysAgo * DAY - DAY);
    const [row] = await db.insert(wps).values({ shopId, reference: w.reference, createdBy: leadId, createdAt: first }).returning({ id: wps.id });
    wpsIds.set(w.reference, row!.id);
    for (const [i, r] of w.revisions.entries()) {
      const publishedAt = new Date(now.getTime() - r.publishedDaysAgo * DAY);
      const next = w.revisions[i + 1];
      const retiredAt = next ? new Date(now.getTime() - next.publishedDaysAgo * DAY) : null;
      await db.insert(wpsRevision).values({
        shopId,
        wpsId: row!.id,
        number: i + 1,
        status: retiredAt ? "retired" : "published",
        ...r.content,
        positions: [...r.content.positions],
        changeNote: r.changeNote,
        authorId: leadId,
        publisherId: leadId,
        publishedAt,
        retiredAt,
        retiredBy: retiredAt ? leadId : null,
        retireNote: retiredAt ? (r.retireNote ?? `Superseded by revision ${i + 2}.`) : null,
        createdAt: new Date(publishedAt.getTime() - DAY),
        updatedAt: retiredAt ?? publishedAt,
      });
    }
    created.push(`WPS ${w.reference}`);
  }

  for (const q of QUALIFICATIONS[s.slug] ?? []) {
    const welderId = idOf.get(q.email);
    if (!welderId) continue;
    const [existing] = await db
      .select({ id: welderQualification.id })
      .from(welderQualification)
      .where(and(eq(welderQualification.shopId, shopId), eq(welderQualification.welderUserId, welderId), eq(welderQualification.process, q.process)));
    if (existing) continue;
    const lastUse = q.lastUse(today);
    await db.insert(welderQualification).values({
      shopId,
      welderUserId: welderId,
      process: q.process,
      positions: [...q.positions],
      thicknessMinMm: q.thicknessMinMm,
      thicknessMaxMm: q.thicknessMaxMm,
      diameterMinMm: q.diameterMinMm,
      fillerFNumber: q.fillerFNumber,
      testDate: addDays(lastUse, -q.testDaysBeforeUse),
      wpsId: q.wpsReference ? (wpsIds.get(q.wpsReference) ?? null) : null,
      notes: q.notes,
      createdBy: leadId,
    });
    await db.insert(welderProcessUse).values({ shopId, welderUserId: welderId, process: q.process, lastUsedOn: lastUse }).onConflictDoNothing();
    created.push(`qualification ${q.email} ${q.process}`);
  }
  return created;
}
