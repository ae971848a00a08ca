// The weld map: where each weld joint is on the part. A joint's marker is a point (and optionally a line
// along the seam) on an image, in image-relative coordinates (0..1 from the left and from the top), so the
// same marker lands on the same spot whatever size the image is drawn at. Pure: the editor, the runner,
// the server and the traveller share these rules.
import { z } from "zod";

export const WELD_MAP_MAX_IMAGES = 8;
export const WELD_MAP_MAX_PATH_POINTS = 24;

const unit = (what: string) => z.number({ message: `${what} must be a number.` }).finite(`${what} must be a finite number.`).min(0, `${what} is 0 or more (a share of the image).`).max(1, `${what} is 1 or less (a share of the image).`);

export const mapPointSchema = z.object({ x: unit("x"), y: unit("y") }).strict();
export type MapPoint = z.output<typeof mapPointSchema>;

const jointIdSchema = z.string().regex(/^W\d{1,3}$/, "A joint id is W followed by a number (W1, W2…).");
const imageIdSchema = z.uuid("An image id is a UUID.");

export const mapJointSchema = z
  .object({
    jointId: jointIdSchema,
    imageId: imageIdSchema,
    x: unit("x"),
    y: unit("y"),
    /** points along the seam, in order; the marker sits at (x, y) */
    path: z.array(mapPointSchema).min(2, "A seam line needs at least 2 points.").max(WELD_MAP_MAX_PATH_POINTS, `A seam line has at most ${WELD_MAP_MAX_PATH_POINTS} points.`).optional(),
  })
  .strict();
export type MapJoint = z.output<typeof mapJointSchema>;

export const IMAGE_SOURCES = ["upload", "pdf", "drawing"] as const;

/** An image of a procedure's map: stored once (procedure_image), named here by id and the SHA-256 of its bytes. */
export const procedureMapImageSchema = z
  .object({
    id: imageIdSchema,
    sha256: z.string().regex(/^[0-9a-f]{64}$/, "sha256 is 64 lower-case hex digits."),
    width: z.number().int().min(1).max(10_000),
    height: z.number().int().min(1).max(10_000),
    source: z.enum(IMAGE_SOURCES, { message: "source is upload, pdf or drawing." }),
    label: z.string().trim().max(120, "At most 120 characters.").default(""),
  })
  .strict();
export type ProcedureMapImage = z.output<typeof procedureMapImageSchema>;

function refsProblems(map: { images: readonly { id: string }[]; joints: readonly { jointId: string; imageId: string }[] }, ctx: z.RefinementCtx) {
  const ids = new Set<string>();
  map.images.forEach((img, i) => {
    if (ids.has(img.id)) ctx.addIssue({ code: "custom", path: ["images", i, "id"], message: "An image appears twice on the map." });
    ids.add(img.id);
  });
  const seen = new Set<string>();
  map.joints.forEach((j, i) => {
    if (!ids.has(j.imageId)) ctx.addIssue({ code: "custom", path: ["joints", i, "imageId"], message: `${j.jointId} is placed on an image that is not on the map.` });
    if (seen.has(j.jointId)) ctx.addIssue({ code: "custom", path: ["joints", i, "jointId"], message: `${j.jointId} is placed twice; a joint has one marker.` });
    seen.add(j.jointId);
  });
}

export const procedureWeldMapSchema = z
  .object({
    images: z.array(procedureMapImageSchema).max(WELD_MAP_MAX_IMAGES, `At most ${WELD_MAP_MAX_IMAGES} images on a weld map.`),
    joints: z.array(mapJointSchema).max(500),
  })
  .strict()
  .superRefine(refsProblems)
  .meta({ description: "Where each weld joint is: markers in image-relative coordinates (0..1) on the map's images." });
export type ProcedureWeldMap = z.output<typeof procedureWeldMapSchema>;

/** A job's map: the procedure's images, or a photo of this axle taken on the job (a re-based map). */
export const jobMapImageSchema = z.union([
  z.object({ id: imageIdSchema, procedureImageId: imageIdSchema, sha256: z.string(), width: z.number().int(), height: z.number().int() }).strict(),
  z.object({ id: imageIdSchema, photoId: imageIdSchema, sha256: z.string(), width: z.number().int(), height: z.number().int() }).strict(),
]);
export type JobMapImage = z.output<typeof jobMapImageSchema>;
export type JobWeldMap = { images: JobMapImage[]; joints: MapJoint[]; rebasedAt?: string; rebasedBy?: string };

/** The job's map as the procedure version gives it: the same images (by their procedure image ids) and markers. */
export function jobMapFromProcedure(map: ProcedureWeldMap | undefined | null): JobWeldMap | null {
  if (!map || !map.joints.length) return null;
  return {
    images: map.images.map((i) => ({ id: i.id, procedureImageId: i.id, sha256: i.sha256, width: i.width, height: i.height })),
    joints: map.joints.map((j) => ({ ...j, ...(j.path ? { path: j.path.map((p) => ({ ...p })) } : {}) })),
  };
}

/** The map as a release seals it: each image by its source and SHA-256, each marker where it stands. */
export function sealedWeldMap(
  map: { images: readonly { id: string; photoId?: string; procedureImageId?: string; sha256: string; width: number; height: number }[]; joints: readonly MapJoint[] } | null | undefined,
): Record<string, unknown> | null {
  if (!map || !map.joints.length) return null;
  return {
    images: map.images.map((i) => ({ id: i.id, ...(i.photoId ? { photoId: i.photoId } : { procedureImageId: i.procedureImageId }), sha256: i.sha256, width: i.width, height: i.height })),
    joints: [...map.joints].sort((a, b) => Number(a.jointId.slice(1)) - Number(b.jointId.slice(1))).map((j) => ({ jointId: j.jointId, imageId: j.imageId, x: j.x, y: j.y, ...(j.path ? { path: j.path } : {}) })),
  };
}

/** Drops markers of joints the steps no longer have and images no marker uses (after a step is removed or renamed). */
export function pruneWeldMap<M extends { images: { id: string }[]; joints: { jointId: string; imageId: string }[] }>(map: M, jointIds: readonly string[]): M {
  const keep = new Set(jointIds);
  const joints = map.joints.filter((j) => keep.has(j.jointId));
  return { ...map, joints };
}

/** Weld joints of the steps that have no marker yet, in step order. */
export function unplacedJoints(jointIds: readonly string[], map: { joints: readonly { jointId: string }[] } | null | undefined): string[] {
  const placed = new Set((map?.joints ?? []).map((j) => j.jointId));
  return jointIds.filter((id) => !placed.has(id));
}

// ── Drawings made in Gusset: a blank sheet with simple shapes, rendered to an image on the server ───────

const coord = z.number().finite().min(0).max(1);
export const drawingShapeSchema = z.discriminatedUnion(
  "type",
  [
    z.object({ type: z.literal("rect"), x: coord, y: coord, w: coord, h: coord }).strict(),
    z.object({ type: z.literal("ellipse"), cx: coord, cy: coord, rx: coord, ry: coord }).strict(),
    z.object({ type: z.literal("line"), x1: coord, y1: coord, x2: coord, y2: coord }).strict(),
    z.object({ type: z.literal("text"), x: coord, y: coord, text: z.string().trim().min(1, "Write the label.").max(60, "A label is at most 60 characters.") }).strict(),
  ],
  { message: "A shape is rect, ellipse, line or text." },
);
export type DrawingShape = z.output<typeof drawingShapeSchema>;

export const drawingSchema = z
  .object({
    title: z.string().trim().max(80, "At most 80 characters.").default(""),
    aspect: z.enum(["4:3", "3:2", "16:9", "1:1"], { message: "aspect is 4:3, 3:2, 16:9 or 1:1." }).default("4:3"),
    shapes: z.array(drawingShapeSchema).max(60, "At most 60 shapes on a drawing."),
  })
  .strict();
export type Drawing = z.output<typeof drawingSchema>;

const ASPECT: Record<Drawing["aspect"], [number, number]> = { "4:3": [1600, 1200], "3:2": [1620, 1080], "16:9": [1600, 900], "1:1": [1200, 1200] };

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

/**
 * The SVG text of a drawing, built here from checked numbers and escaped labels only: nothing from outside is
 * ever passed through as markup, which is why a drawing is safe to render while uploaded SVG files are refused.
 */
export function drawingSvg(d: Drawing): { svg: string; width: number; height: number } {
  const [W, H] = ASPECT[d.aspect];
  const stroke = `stroke="#2a2e2c" stroke-width="${Math.round(W / 260)}" fill="none" stroke-linejoin="round" stroke-linecap="round"`;
  const parts = d.shapes.map((s) => {
    switch (s.type) {
      case "rect":
        return `<rect x="${s.x * W}" y="${s.y * H}" width="${s.w * W}" height="${s.h * H}" ${stroke}/>`;
      case "ellipse":
        return `<ellipse cx="${s.cx * W}" cy="${s.cy * H}" rx="${s.rx * W}" ry="${s.ry * H}" ${stroke}/>`;
      case "line":
        return `<line x1="${s.x1 * W}" y1="${s.y1 * H}" x2="${s.x2 * W}" y2="${s.y2 * H}" ${stroke}/>`;
      case "text":
        return `<text x="${s.x * W}" y="${s.y * H}" font-family="sans-serif" font-size="${Math.round(H / 24)}" fill="#2a2e2c">${esc(s.text)}</text>`;
    }
  });
  const title = d.title ? `<text x="${W * 0.03}" y="${H * 0.07}" font-family="sans-serif" font-weight="700" font-size="${Math.round(H / 20)}" fill="#2a2e2c">${esc(d.title)}</text>` : "";
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}"><rect width="${W}" height="${H}" fill="#ffffff"/>${title}${parts.join("")}</svg>`;
  return { svg, width: W, height: H };
}

/** A plain side view of an axle tube with a bracket: the starting sheet a lead can draw on, and the demo's drawing. */
export function axleBracketDrawing(title = "Axle tube and bracket (side view)"): Drawing {
  return {
    title,
    aspect: "4:3",
    shapes: [
      { type: "rect", x: 0.06, y: 0.46, w: 0.88, h: 0.16 },
      { type: "ellipse", cx: 0.06, cy: 0.54, rx: 0.02, ry: 0.08 },
      { type: "ellipse", cx: 0.94, cy: 0.54, rx: 0.02, ry: 0.08 },
      { type: "rect", x: 0.36, y: 0.2, w: 0.28, h: 0.26 },
      { type: "ellipse", cx: 0.5, cy: 0.3, rx: 0.04, ry: 0.053 },
      { type: "text", x: 0.07, y: 0.72, text: "Axle tube" },
      { type: "text", x: 0.66, y: 0.24, text: "Bracket" },
    ],
  };
}

/** Where the demo places joints on the axle-and-bracket drawing: along the bracket's toes, one after another. */
export function defaultPlacement(jointIds: readonly string[], imageId: string): MapJoint[] {
  const spots: { x: number; y: number; path: MapPoint[] }[] = [
    { x: 0.42, y: 0.46, path: [{ x: 0.36, y: 0.46 }, { x: 0.5, y: 0.46 }] },
    { x: 0.58, y: 0.46, path: [{ x: 0.5, y: 0.46 }, { x: 0.64, y: 0.46 }] },
    { x: 0.36, y: 0.33, path: [{ x: 0.36, y: 0.22 }, { x: 0.36, y: 0.45 }] },
    { x: 0.64, y: 0.33, path: [{ x: 0.64, y: 0.22 }, { x: 0.64, y: 0.45 }] },
  ];
  return jointIds.map((jointId, i) => {
    const s = spots[i % spots.length]!;
    const shift = Math.floor(i / spots.length) * 0.04;
    return { jointId, imageId, x: Math.min(1, s.x + shift), y: s.y, path: s.path.map((p) => ({ x: Math.min(1, p.x + shift), y: p.y })) };
  });
}
