// The weld map's rules: markers name real joints on real images, coordinates are shares of the image, and the
// markers are part of what a version's hash seals.
import { describe, expect, it } from "vitest";
import { versionHash } from "@/lib/procedures/hash";
import { versionContentSchema } from "@/lib/procedures/schema";
import { procedureWeldMapSchema, sealedWeldMap, unplacedJoints } from "@/lib/weld-map";
import { relativePoint } from "@/lib/weld-map/marker";

const imageId = "6f1c2a3b-4d5e-4f60-8a7b-9c0d1e2f3a4b";
const image = { id: imageId, sha256: "b".repeat(64), width: 1600, height: 1200, source: "drawing" as const, label: "" };
const weld = (key: string, jointId: string) => ({
  key,
  kind: "weld",
  title: `Weld ${jointId}`,
  jointId,
  jointType: "fillet",
  sizeMm: 6,
  lengthMm: 80,
  position: "2F",
  process: "GMAW",
  wpsRef: "GUS-GMAW-02",
  filler: "ER70S-6",
  minPreheatC: 10,
});
const sections = [{ key: "s", title: "Weld", steps: [weld("a", "W1"), weld("b", "W2")] }];

describe("weld map rules", () => {
  it("takes markers in image shares; refuses a marker off the image, on an image not on the map, or placed twice", () => {
    expect(procedureWeldMapSchema.safeParse({ images: [image], joints: [{ jointId: "W1", imageId, x: 0, y: 1 }] }).success).toBe(true);
    const off = procedureWeldMapSchema.safeParse({ images: [image], joints: [{ jointId: "W1", imageId, x: 1.01, y: 0.5 }] });
    expect(off.error?.issues[0]?.message).toMatch(/1 or less/);
    const stray = procedureWeldMapSchema.safeParse({ images: [], joints: [{ jointId: "W1", imageId, x: 0.5, y: 0.5 }] });
    expect(stray.error?.issues[0]?.message).toMatch(/not on the map/);
    const twice = procedureWeldMapSchema.safeParse({ images: [image], joints: [{ jointId: "W1", imageId, x: 0.1, y: 0.1 }, { jointId: "W1", imageId, x: 0.2, y: 0.2 }] });
    expect(twice.error?.issues[0]?.message).toMatch(/placed twice/);
  });

  it("a version's map may only place joints its weld steps have", () => {
    const r = versionContentSchema.safeParse({ sections, weldMap: { images: [image], joints: [{ jointId: "W7", imageId, x: 0.5, y: 0.5 }] } });
    expect(r.error?.issues[0]?.message).toBe("The weld map places W7, but no weld step has that joint.");
  });

  it("a tap is turned into shares of the box it landed in, clamped to the image", () => {
    // 300 px into a 1000 px wide box is 0.3 of its width, whatever size the image is drawn at.
    expect(relativePoint(300, 450, 1000, 750)).toEqual({ x: 0.3, y: 0.6 });
    expect(relativePoint(150, 225, 500, 375)).toEqual({ x: 0.3, y: 0.6 });
    expect(relativePoint(-5, 900, 1000, 750)).toEqual({ x: 0, y: 1 });
  });

  it("names the joints not placed yet, in step order", () => {
    expect(unplacedJoints(["W1", "W2", "W3"], { joints: [{ jointId: "W2" }] })).toEqual(["W1", "W3"]);
  });

  it("markers are sealed with the version: moving one changes the version's hash", () => {
    const content = versionContentSchema.parse({ sections, weldMap: { images: [image], joints: [{ jointId: "W1", imageId, x: 0.4, y: 0.5 }, { jointId: "W2", imageId, x: 0.6, y: 0.5 }] } });
    const body = { title: "T", scope: "", code: "", content };
    const moved = structuredClone(content);
    moved.weldMap!.joints[1]!.y = 0.51;
    expect(versionHash({ ...body, content: moved })).not.toBe(versionHash(body));
    const { weldMap: _none, ...withoutMap } = content;
    expect(versionHash({ ...body, content: withoutMap })).not.toBe(versionHash(body));
  });

  it("the release seals the map in joint order, whatever order the markers were placed in", () => {
    const a = sealedWeldMap({ images: [{ ...image, procedureImageId: imageId }], joints: [{ jointId: "W10", imageId, x: 0.1, y: 0.1 }, { jointId: "W2", imageId, x: 0.2, y: 0.2 }] });
    expect((a!.joints as { jointId: string }[]).map((j) => j.jointId)).toEqual(["W2", "W10"]);
    expect(sealedWeldMap({ images: [], joints: [] })).toBeNull();
  });
});
