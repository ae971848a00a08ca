// Demo procedures for a shop: the starter templates as published version 1, and one procedure with a
// history (version 1 retired, 2 published, a draft 3) so the version list and the diff have something to show.
// Idempotent: a procedure whose title the shop already has is left alone.
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import * as schema from "@/db/schema";
import { versionHash } from "@/lib/procedures/hash";
import { versionContentSchema, weldJointIds, type VersionContent } from "@/lib/procedures/schema";
import { axleBracketDrawing, defaultPlacement, drawingSvg } from "@/lib/weld-map";
import type { SeedPhotoStore } from "./photos";
import { starterTemplates } from "@/lib/procedures/templates";

type SeedDb = NodePgDatabase<typeof schema> | Parameters<Parameters<NodePgDatabase<typeof schema>["transaction"]>[0]>[0];

const { procedure, procedureImage, procedureVersion } = schema;
const DAY = 86_400_000;

const HISTORY_TITLE = "Visual inspection of bracket welds";
const HISTORY_SCOPE =
  "Visual inspection of fillet welds joining brackets to axle tubes and frames, joint by joint, before coating or reassembly.\n\n" +
  "This procedure supports, and never replaces, the vehicle maker's specifications, local codes and qualified or licensed practice.";
const HISTORY_CODE = "AWS D1.1 visual acceptance, statically loaded nontubular connections";

const historyV1: VersionContent = versionContentSchema.parse({
  sections: [
    {
      key: "vi-prepare",
      title: "Before inspecting",
      steps: [
        {
          key: "vi-light",
          kind: "check",
          title: "Good light, clean welds, gauges at hand",
          instructions: "Slag and spatter brushed off. A torch or lamp you can angle along the weld, a fillet gauge set and an undercut gauge.",
          signedBy: "inspector",
        },
      ],
    },
    {
      key: "vi-inspect",
      title: "Inspect each joint",
      steps: [
        {
          key: "vi-cracks",
          kind: "check",
          title: "No cracks, complete fusion, craters filled",
          instructions: "Look along the whole length and at both toes. Any crack rejects the joint, whatever its length.",
          signedBy: "inspector",
        },
        {
          key: "vi-undersize",
          kind: "measure",
          title: "Largest fillet undersize against the joint's size",
          instructions: "Fillet gauge at the smallest point. For a 5 mm fillet the code allows 1.6 mm under, over no more than 10 % of the length.",
          signedBy: "inspector",
          quantity: "length",
          tolerance: { type: "max", max: 1.6 },
        },
        {
          key: "vi-undercut",
          kind: "measure",
          title: "Deepest undercut",
          instructions: "Undercut gauge at the deepest point on either toe.",
          signedBy: "inspector",
          quantity: "length",
          tolerance: { type: "max", max: 1 },
        },
        {
          key: "vi-photo",
          kind: "photo",
          title: "Photo of the joint",
          instructions: "Square on, with the fillet gauge in view.",
          signedBy: "inspector",
          photos: { required: true, min: 1 },
        },
        {
          key: "vi-accept",
          kind: "hold",
          title: "Joint accepted",
          instructions: "Hold point: no coating or reassembly until signed.",
          signedBy: "inspector",
          inspection: "Every check above within its limit. Anything outside: reject and raise a nonconformance.",
        },
      ],
    },
  ],
});

function historyV2(): VersionContent {
  const c = structuredClone(historyV1);
  c.sections[0]!.steps.unshift({
    key: "vi-hot-metal",
    kind: "caution",
    title: "Hot metal and wire brushing",
    instructions: "Welds stay hot long after they stop glowing. Gloves and safety glasses for brushing and gauging.",
    signedBy: "inspector",
    photos: { required: false, min: 0 },
    hazards: ["ppe"],
    acknowledgement: "I wear gloves and safety glasses and have checked the weld is safe to touch.",
  });
  c.sections[0]!.steps.push({
    key: "vi-cooled",
    kind: "check",
    title: "Welds cooled to ambient before inspection",
    instructions: "AWS D1.1 visual inspection is made once the weld has cooled to ambient temperature: a hot weld can still crack.",
    signedBy: "inspector",
    photos: { required: false, min: 0 },
  });
  const inspect = c.sections[1]!.steps;
  const undercut = inspect.find((s) => s.key === "vi-undercut")!;
  undercut.instructions =
    "Undercut gauge at the deepest point on either toe. Material under 25 mm: at most 1 mm, except up to 2 mm over an accumulated 50 mm in any 300 mm of weld. Enter the deepest reading and note its length.";
  if (undercut.kind === "measure") undercut.tolerance = { type: "max", max: 2 };
  const photo = inspect.find((s) => s.key === "vi-photo")!;
  photo.title = "Photos of the joint";
  photo.photos = { required: true, min: 2 };
  photo.instructions = "Square on with the fillet gauge in view, and along the weld with the light raking across it.";
  return c;
}

function historyV3(): VersionContent {
  const c = historyV2();
  const inspect = c.sections[1]!.steps;
  const at = inspect.findIndex((s) => s.key === "vi-photo");
  inspect.splice(at, 0, {
    key: "vi-porosity",
    kind: "measure",
    title: "Visible porosity in the worst 25 mm",
    instructions: "Add up the diameters of visible pores of 1 mm or more in the worst 25 mm of weld. The code limit is 10 mm in any 25 mm and 20 mm in any 300 mm.",
    signedBy: "inspector",
    photos: { required: false, min: 0 },
    quantity: "length",
    tolerance: { type: "max", max: 10 },
  });
  return c;
}

async function hasProcedure(db: SeedDb, shopId: string, title: string) {
  const [row] = await db.select({ id: procedure.id }).from(procedure).where(and(eq(procedure.shopId, shopId), eq(procedure.title, title)));
  return Boolean(row);
}

type SeedVersion = {
  status: "published" | "retired" | "draft";
  content: VersionContent;
  changeNote?: string;
  createdAt: Date;
  publishedAt?: Date;
  retiredAt?: Date;
};

// A procedure with weld steps gets a drawing of the tube and bracket with every joint marked on it.
async function withDrawnMap(db: SeedDb, photos: SeedPhotoStore | null, shopId: string, procedureId: string, leadUserId: string, content: VersionContent, at: Date): Promise<VersionContent> {
  const joints = weldJointIds(content);
  if (!photos || !joints.length) return content;
  const imageId = randomUUID();
  const drawing = axleBracketDrawing();
  const stored = await photos.putProcedureImage({ shopId, procedureId, imageId, svg: drawingSvg(drawing).svg });
  await db.insert(procedureImage).values({
    id: imageId,
    shopId,
    procedureId,
    key: stored.key,
    thumbKey: stored.thumbKey,
    sha256: stored.sha256,
    contentType: "image/jpeg",
    size: stored.size,
    width: stored.width,
    height: stored.height,
    source: "drawing",
    originalType: "image/svg+xml",
    uploadedBy: leadUserId,
    uploadedAt: at,
  });
  return versionContentSchema.parse({
    ...content,
    weldMap: { images: [{ id: imageId, sha256: stored.sha256, width: stored.width, height: stored.height, source: "drawing", label: drawing.title }], joints: defaultPlacement(joints, imageId) },
  });
}

async function insertProcedure(db: SeedDb, shopId: string, leadUserId: string, meta: { title: string; scope: string; code: string }, versions: SeedVersion[], photos: SeedPhotoStore | null = null) {
  const first = versions[0]!.createdAt;
  const [p] = await db.insert(procedure).values({ shopId, ownerId: leadUserId, createdAt: first, ...meta }).returning({ id: procedure.id });
  for (const v of versions) v.content = await withDrawnMap(db, photos, shopId, p!.id, leadUserId, v.content, first);
  for (const [i, v] of versions.entries()) {
    const sealed = v.status !== "draft";
    await db.insert(procedureVersion).values({
      shopId,
      procedureId: p!.id,
      number: i + 1,
      status: v.status,
      ...meta,
      content: v.content,
      contentHash: sealed ? versionHash({ ...meta, content: v.content }) : null,
      changeNote: sealed ? v.changeNote! : null,
      authorId: leadUserId,
      publisherId: sealed ? leadUserId : null,
      createdAt: v.createdAt,
      updatedAt: v.publishedAt ?? v.createdAt,
      publishedAt: v.publishedAt ?? null,
      retiredAt: v.retiredAt ?? null,
    });
  }
}

export async function seedProcedures(db: SeedDb, shopId: string, leadUserId: string, photos: SeedPhotoStore | null = null): Promise<string[]> {
  const created: string[] = [];
  const now = Date.now();
  for (const [i, { file }] of starterTemplates().entries()) {
    if (await hasProcedure(db, shopId, file.procedure.title)) continue;
    const at = new Date(now - (90 - i) * DAY);
    await insertProcedure(db, shopId, leadUserId, file.procedure, [
      { status: "published", content: file.content, changeNote: "First issue, from Gusset's starter templates.", createdAt: at, publishedAt: at },
    ], photos);
    created.push(`procedure ${file.procedure.title}`);
  }
  if (!(await hasProcedure(db, shopId, HISTORY_TITLE))) {
    await insertProcedure(db, shopId, leadUserId, { title: HISTORY_TITLE, scope: HISTORY_SCOPE, code: HISTORY_CODE }, [
      {
        status: "retired",
        content: historyV1,
        changeNote: "First issue.",
        createdAt: new Date(now - 200 * DAY),
        publishedAt: new Date(now - 199 * DAY),
        retiredAt: new Date(now - 40 * DAY),
      },
      {
        status: "published",
        content: historyV2(),
        changeNote:
          "Inspect only once the welds are at ambient temperature (AWS D1.1); undercut allowance of 2 mm over 50 mm in any 300 mm; two photos per joint; a caution for hot metal added.",
        createdAt: new Date(now - 45 * DAY),
        publishedAt: new Date(now - 40 * DAY),
      },
      { status: "draft", content: historyV3(), createdAt: new Date(now - 2 * DAY) },
    ]);
    created.push(`procedure ${HISTORY_TITLE} (3 versions)`);
  }
  return created;
}
