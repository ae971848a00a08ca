import { describe, expect, it } from "vitest";
import { api, session } from "./support";

// POST /api/calc/steering. Expected values come from REFERENCES.md "Steering links" (calc) and from the
// closed form printed there, Δy = √(L² − z₀²) − √(L² − (z₀ + Δz)²), worked here independently of lib/geometry.
const IN = 25.4; // NIST SP 811 (2008) App. B: 1 in = 25.4 mm exactly
const RAD = Math.PI / 180;
const lateralShift = (L: number, z0: number, dz: number) => Math.sqrt(L * L - z0 * z0) - Math.sqrt(L * L - (z0 + dz) * (z0 + dz));

function layout(over: Record<string, unknown> = {}) {
  return {
    trackBar: { frameEnd: { y: 0, z: 0 }, axleEnd: { y: 36 * IN, z: 0 } },
    dragLink: { pitmanEnd: { y: 0, z: 100 }, knuckleEnd: { y: 34 * IN * Math.cos(6 * RAD), z: 100 + 34 * IN * Math.sin(6 * RAD) } },
    axleCenter: { y: 18 * IN, z: -60 },
    steeringArmLength: 6 * IN,
    travel: { bump: 4 * IN, droop: 0, step: 4 * IN },
    ...over,
  };
}

describe("POST /api/calc/steering", () => {
  it("REFERENCES worked example: level 36 in lateral link, 34 in drag link at 6°, +4 in bump → 0.44 in mismatch, ≈ 4.2° on a 6 in arm", async () => {
    const r = await api("/api/calc/steering", { body: layout() });
    expect(r.status).toBe(200);
    expect(r.json.trackBarAngleDeg).toBeCloseTo(0, 9);
    expect(r.json.dragLinkAngleDeg).toBeCloseTo(6, 9);
    expect(r.json.angleDifferenceDeg).toBeCloseTo(6, 9);
    const bump = r.json.heave.at(-1);
    expect(bump.travel).toBeCloseTo(4 * IN, 9);
    // REFERENCES.md: 0.44 in (rounded) and ≈ 4.2° (rounded)
    expect(Math.abs(bump.dragLinkError) / IN).toBeCloseTo(0.44, 2);
    expect(Math.abs(bump.wheelSteerDeg)).toBeCloseTo(4.2, 1);
    // Closed form: link shift of the level bar minus that of the drag link, each by REFERENCES' Δy formula.
    const expected = lateralShift(36 * IN, 0, 4 * IN) - lateralShift(34 * IN, 34 * IN * Math.sin(6 * RAD), 4 * IN);
    expect(Math.abs(bump.dragLinkError)).toBeCloseTo(Math.abs(expected), 6);
    expect(r.json.worst.heave.travel).toBeCloseTo(4 * IN, 9);
    expect(r.json.worst.overall.source).toBe("heave");
    expect(r.json.roll).toEqual([]);
  });

  it("REFERENCES worked example: 36 in level bar, ±4 in → 0.223 in lateral shift of the axle", async () => {
    const r = await api("/api/calc/steering", {
      body: layout({
        // Drag link parallel and equal to the bar, so the only figure of interest is the axle's shift.
        dragLink: { pitmanEnd: { y: 0, z: 150 }, knuckleEnd: { y: 36 * IN, z: 150 } },
        travel: { bump: 4 * IN, droop: 4 * IN, step: 4 * IN },
      }),
    });
    expect(r.status).toBe(200);
    expect(r.json.heave).toHaveLength(3);
    for (const p of [r.json.heave[0], r.json.heave[2]]) expect(Math.abs(p.axleShift) / IN).toBeCloseTo(0.223, 3);
    // Parallel and equal links (REFERENCES: practice/calc): no bump steer at all.
    for (const p of r.json.heave) expect(Math.abs(p.wheelSteerDeg)).toBeLessThan(1e-9);
  });

  it("ranks candidate holes: the hole that makes the lateral link parallel to the drag link steers least (DESIGN.md item 1, first order)", async () => {
    // Drag link at 6° from P; holes on the axle-end line y = 36 in. Parallel height: z = F.z + 36 in × tan 6°.
    const parallelZ = 36 * IN * Math.tan(6 * RAD);
    const r = await api("/api/calc/steering", {
      body: layout({
        steeringRatio: 16,
        travel: { bump: 3 * IN, droop: 3 * IN, step: 0.5 * IN },
        roll: { maxDeg: 4, stepDeg: 1 },
        candidateHoles: [
          { y: 36 * IN, z: 0, label: "level" },
          { y: 36 * IN, z: parallelZ, label: "parallel" },
          { y: 36 * IN, z: 2 * parallelZ, label: "steep" },
        ],
      }),
    });
    expect(r.status).toBe(200);
    expect(r.json.holes.map((h: { label: string }) => h.label)[0]).toBe("parallel");
    expect(r.json.holes.map((h: { rank: number }) => h.rank)).toEqual([1, 2, 3]);
    const best = r.json.holes[0];
    expect(best.trackBarAngleDeg).toBeCloseTo(6, 9);
    // Parallel links leave only the second-order length mismatch: far less than the level bar's figure.
    const level = r.json.holes.find((h: { label: string }) => h.label === "level");
    expect(Math.abs(best.worstWheelSteerDeg)).toBeLessThan(Math.abs(level.worstWheelSteerDeg) / 10);
    expect(r.json.parallelHeightZ).toBeCloseTo(parallelZ, 6);
    expect(r.json.roll).toHaveLength(9);
    expect(r.json.worst.roll).not.toBeNull();
    expect(r.json.worst.overall.steeringWheelDeg).toBeCloseTo(r.json.worst.overall.wheelSteerDeg * 16, 9);
    expect(r.json.heave[0].steeringWheelDeg).toBeCloseTo(r.json.heave[0].wheelSteerDeg * 16, 9);
  });

  it("is open to anyone (no shop data) and answers a signed-in member alike", async () => {
    const anonymous = await api("/api/calc/steering", { body: layout() });
    const member = await api("/api/calc/steering", { body: layout(), session: await session("auditor@irongully.example") });
    expect(anonymous.status).toBe(200);
    expect(member.status).toBe(200);
    expect(member.json.heave).toEqual(anonymous.json.heave);
  });

  it("bad input answers 400 with the paths of the fields", async () => {
    const r = await api("/api/calc/steering", {
      body: {
        trackBar: { frameEnd: { y: "a lot", z: 0 }, axleEnd: { y: 900 } },
        dragLink: { pitmanEnd: { y: 0, z: 0 }, knuckleEnd: { y: 800, z: 0 } },
        axleCenter: { y: 0, z: 0 },
        steeringArmLength: -5,
        travel: { bump: 100, droop: -1, step: 0 },
        candidateHoles: [{ y: 900, z: 1e9 }],
      },
    });
    expect(r.status).toBe(400);
    expect(r.json.error.code).toBe("bad_request");
    expect(Object.keys(r.json.error.fields)).toEqual(
      expect.arrayContaining(["trackBar.frameEnd.y", "trackBar.axleEnd.z", "steeringArmLength", "travel.droop", "travel.step", "candidateHoles.0.z"]),
    );
    const missing = await api("/api/calc/steering", { body: {} });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.json.error.fields)).toEqual(expect.arrayContaining(["trackBar", "dragLink", "axleCenter", "steeringArmLength", "travel"]));
    const notJson = await api("/api/calc/steering", { body: "{trackBar:" });
    expect(notJson.status).toBe(400);
    expect(notJson.json.error.message).toMatch(/not valid JSON/);
    // Never a 500: JSON that is not an object is still the caller's mistake.
    for (const body of ["null", "[]", "42", '"steering"']) {
      const r2 = await api("/api/calc/steering", { body });
      expect(r2.status, body).toBe(400);
      expect(r2.json.error.code).toBe("bad_request");
    }
  });

  it("refuses more work than one request may take, on travel.step (400)", async () => {
    // 10,001 heave points × 500 holes is inside the library's own limits but over the route's budget.
    const r = await api("/api/calc/steering", {
      body: layout({ travel: { bump: 100, droop: 100, step: 0.02 }, holeRange: { zMin: 0, zMax: 499, pitch: 1 } }),
    });
    expect(r.status).toBe(400);
    expect(r.json.error.fields["travel.step"][0]).toMatch(/at most 1,000,000/);
  });

  it("impossible geometry answers 422 with the reason", async () => {
    // A 300 mm lateral link cannot follow 400 mm of bump.
    const unreachable = await api("/api/calc/steering", {
      body: layout({ trackBar: { frameEnd: { y: 0, z: 0 }, axleEnd: { y: 300, z: 0 } }, travel: { bump: 400, droop: 0, step: 400 } }),
    });
    expect(unreachable.status).toBe(422);
    expect(unreachable.json.error.code).toBe("unprocessable");
    expect(unreachable.json.error.reason).toBe("unreachable");
    expect(unreachable.json.error.message).toMatch(/cannot reach/);
    // A lateral link that is vertical in front view locates nothing sideways.
    const vertical = await api("/api/calc/steering", { body: layout({ trackBar: { frameEnd: { y: 0, z: 0 }, axleEnd: { y: 0, z: 400 } } }) });
    expect(vertical.status).toBe(422);
    expect(vertical.json.error.reason).toBe("vertical_link");
    // Zero-length drag link.
    const zero = await api("/api/calc/steering", { body: layout({ dragLink: { pitmanEnd: { y: 5, z: 5 }, knuckleEnd: { y: 5, z: 5 } } }) });
    expect(zero.status).toBe(422);
    expect(zero.json.error.reason).toBe("zero_length_link");
  });
});

describe("POST /api/calc/steering: optimum and the anonymous work limit", () => {
  it("answers optimum { z, worstWheelSteerDeg } on the axle end's vertical line, and the route's own worst at that z matches it", async () => {
    const body = {
      trackBar: { frameEnd: { y: -420, z: 180 }, axleEnd: { y: 480, z: 60 } },
      dragLink: { pitmanEnd: { y: -400, z: 150 }, knuckleEnd: { y: 440, z: 95 } },
      axleCenter: { y: 0, z: 0 },
      steeringArmLength: 160,
      travel: { bump: 100, droop: 100, step: 5 },
      roll: { maxDeg: 5, stepDeg: 0.5 },
    };
    const r = await api("/api/calc/steering", { body });
    expect(r.status).toBe(200);
    const o = r.json.optimum;
    expect(o.y).toBe(480);
    expect(o.worstWheelSteerDeg).toBeGreaterThanOrEqual(0);
    const again = await api("/api/calc/steering", { body: { ...body, trackBar: { ...body.trackBar, axleEnd: { y: 480, z: o.z } } } });
    const listed = Math.max(...again.json.heave.map((p: { wheelSteerDeg: number }) => Math.abs(p.wheelSteerDeg)), ...again.json.roll.map((p: { wheelSteerDeg: number }) => Math.abs(p.wheelSteerDeg)));
    expect(Math.abs(listed - o.worstWheelSteerDeg)).toBeLessThan(1e-9);
    // Better than the bracket as fitted, and every field of before is still there.
    expect(o.worstWheelSteerDeg).toBeLessThan(Math.abs(r.json.worst.overall.wheelSteerDeg));
    expect(r.json.worst.combined).not.toBeNull();
    expect(r.json.optimumFrame.y).toBe(-420);
  });

  it("refuses each of twenty anonymous 200,000-evaluation sweeps with 413 and a reason; a signed-in member gets the same sweep", async () => {
    // 2,001 heave points × (1 + 99 holes) = 200,100 link evaluations: over the anonymous 50,000, under the signed-in 1,000,000.
    const body = {
      ...layout(),
      travel: { bump: 100, droop: 100, step: 0.1 },
      holeRange: { zMin: 0, zMax: 98, pitch: 1 },
    };
    let refused = 0;
    for (let i = 0; i < 20; i++) {
      const r = await api("/api/calc/steering", { body });
      if (r.status === 413 || r.status === 429) {
        refused++;
        expect(r.json.error.message).toMatch(/link evaluations|Too many/);
      }
    }
    expect(refused).toBe(20);
    const member = await api("/api/calc/steering", { body, session: await session("auditor@irongully.example") });
    expect(member.status).toBe(200);
    expect(member.json.holes).toHaveLength(99);
  });
});
