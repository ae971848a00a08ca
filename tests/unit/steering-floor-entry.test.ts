import { describe, expect, it } from "vitest";
import { captureMeta, emptySteeringForm, exampleSteeringForm, pointsFromFloor, toSteeringRequest, withEntry, type SteeringFormState } from "@/components/calc/steering-request";

// Joints measured from the floor and the centre line become front-view coordinates with the floor as z = 0 and
// the centre line as y = 0; seen from ahead, the vehicle's left side is +y, so left-hand drive puts the driver's
// side at +y and right-hand drive at −y. Inches are 25.4 mm exactly (the international inch, 1959).

function measured(drive: "lhd" | "rhd"): SteeringFormState {
  const s = emptySteeringForm("metric", "floor", drive);
  return {
    ...s,
    floor: {
      frameEnd: { height: `23 5/8"`, distance: "16 1/2 in", side: "driver" },
      axleEnd: { height: "480", distance: "480", side: "passenger" },
      pitmanEnd: { height: "570 mm", distance: "400", side: "driver" },
      knuckleEnd: { height: "18-1/2\"", distance: "440", side: "passenger" },
      axleCenter: { height: "420", distance: "0", side: "driver" },
    },
    steeringArmLength: "160",
    travel: { bump: "100", droop: "100", step: "5" },
  };
}

describe("floor and centre-line entry", () => {
  it("right-hand drive: the driver's side is −y; 23 5/8 in = 600.075 mm, 16 1/2 in = 419.1 mm (hand-worked)", () => {
    const out = toSteeringRequest(measured("rhd"));
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.request.trackBar.frameEnd.y).toBeCloseTo(-419.1, 9);
    expect(out.request.trackBar.frameEnd.z).toBeCloseTo(600.075, 9);
    expect(out.request.trackBar.axleEnd).toEqual({ y: 480, z: 480 });
    expect(out.request.dragLink.knuckleEnd.z).toBeCloseTo(469.9, 9);
    expect(out.request.axleCenter).toEqual({ y: 0, z: 420 });
  });

  it("left-hand drive mirrors the same readings", () => {
    const rhd = toSteeringRequest(measured("rhd"));
    const lhd = toSteeringRequest(measured("lhd"));
    if (!rhd.ok || !lhd.ok) throw new Error("both should read");
    expect(lhd.request.trackBar.frameEnd.y).toBeCloseTo(-rhd.request.trackBar.frameEnd.y, 9);
    expect(lhd.request.dragLink.knuckleEnd.y).toBeCloseTo(-rhd.request.dragLink.knuckleEnd.y, 9);
  });

  it("switching to coordinates and back keeps the layout, and a joint below the floor is refused by name", () => {
    const floor = measured("rhd");
    // Shown to 0.01 mm in the coordinate fields.
    const shownPoint = pointsFromFloor(floor).frameEnd!;
    expect(shownPoint.y).toBe("-419.1");
    expect(Number(shownPoint.z)).toBeCloseTo(600.075, 1);
    const coords = withEntry(floor, "coordinates");
    expect(coords.entry).toBe("coordinates");
    const a = toSteeringRequest(floor);
    const b = toSteeringRequest(coords);
    if (!a.ok || !b.ok) throw new Error("both should read");
    expect(b.request.trackBar.axleEnd).toEqual(a.request.trackBar.axleEnd);
    const back = withEntry(coords, "floor");
    expect(back.floor!.frameEnd).toMatchObject({ distance: "419.1", side: "driver" });

    const below = { ...floor, floor: { ...floor.floor!, axleEnd: { ...floor.floor!.axleEnd, height: "-5" } } };
    const refused = toSteeringRequest(below);
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.errors["floor.axleEnd.height"]).toMatch(/below the floor/);
  });

  it("the example opens on the guide, and a capture from it keeps the drive; one typed as coordinates does not", () => {
    const ex = exampleSteeringForm("imperial");
    expect(ex.entry).toBe("floor");
    expect(captureMeta(ex)).toEqual({ unit: "in", drive: "lhd" });
    expect(captureMeta(withEntry(ex, "coordinates"))).toEqual({ unit: "in" });
  });
});
