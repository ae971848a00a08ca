import { describe, expect, it } from "vitest";
import { z } from "zod";
import {
  computeSteeringGeometry,
  GeometryError,
  isGeometryError,
  linkAngleDeg,
  steeringInputSchema,
  type GeometryErrorReason,
  type SteeringInput,
} from "@/lib/geometry";

// NIST SP 811 (2008) App. B: 1 in = 25.4 mm exactly.
const IN = 25.4;
const RAD = Math.PI / 180;
const DEG = 180 / Math.PI;

/** REFERENCES.md "Steering links" (calc): Δy = √(L² − z₀²) − √(L² − (z₀ + Δz)²), the inward move of a link end. */
const lateralShift = (L: number, z0: number, dz: number): number =>
  Math.sqrt(L * L - z0 * z0) - Math.sqrt(L * L - (z0 + dz) * (z0 + dz));

/** A link from `from` of length L at `deg` above horizontal, pointing toward +y. */
const endAt = (from: { y: number; z: number }, L: number, deg: number) => ({
  y: from.y + L * Math.cos(deg * RAD),
  z: from.z + L * Math.sin(deg * RAD),
});

function input(over: Partial<SteeringInput> = {}): SteeringInput {
  const F = { y: -450, z: 200 };
  const P = { y: -430, z: 170 };
  return {
    trackBar: { frameEnd: F, axleEnd: { y: 450, z: 120 } },
    dragLink: { pitmanEnd: P, knuckleEnd: { y: 420, z: 60 } },
    axleCenter: { y: 0, z: 0 },
    steeringArmLength: 6 * IN, // REFERENCES.md worked example uses a 6 in arm
    travel: { bump: 100, droop: 100, step: 10 },
    ...over,
  };
}

function reasonOf(fn: () => unknown): GeometryErrorReason | "no error" | "other error" {
  try {
    fn();
    return "no error";
  } catch (e) {
    if (e instanceof GeometryError && e.code === "impossible_geometry") return e.reason;
    return "other error";
  }
}

describe("REFERENCES.md worked examples (calc)", () => {
  // Level 36 in lateral link; drag link made parallel and equal so it does not get in the way.
  const F = { y: 0, z: 0 };
  const level36: SteeringInput = input({
    trackBar: { frameEnd: F, axleEnd: { y: 36 * IN, z: 0 } },
    dragLink: { pitmanEnd: { y: 0, z: 150 }, knuckleEnd: { y: 36 * IN, z: 150 } },
    travel: { bump: 4 * IN, droop: 4 * IN, step: 4 * IN },
  });

  it("REFERENCES: 36 in level bar, ±4 in → 0.223 in lateral shift", () => {
    const r = computeSteeringGeometry(level36);
    expect(r.heave.map((p) => p.travel)).toEqual([-4 * IN, 0, 4 * IN]);
    for (const p of [r.heave[0]!, r.heave[2]!]) {
      // The axle end swings toward the frame end (−y here) in bump and in droop alike.
      expect(p.axleShift).toBeLessThan(0);
      expect(Math.abs(Math.abs(p.axleShift) / IN - 0.223)).toBeLessThan(0.0005);
      expect(p.axleShift).toBeCloseTo(-lateralShift(36 * IN, 0, p.travel), 9);
    }
    expect(r.heave[1]!.axleShift).toBe(0);
  });

  it("REFERENCES: level bar approximation Δy ≈ Δz²/(2L) holds to its fourth-order remainder", () => {
    const r = computeSteeringGeometry(level36);
    const L = 36 * IN;
    const dz = 4 * IN;
    // Next series term of L − √(L² − Δz²) is Δz⁴/(8L³).
    const remainder = dz ** 4 / (8 * L ** 3);
    expect(Math.abs(-r.heave[2]!.axleShift - (dz * dz) / (2 * L))).toBeLessThan(1.1 * remainder);
  });

  // The 0.44 in figure works out with the drag link's axle end 6° ABOVE its pitman end (bump steepens
  // it); the other reading gives 0.41 in. REFERENCES.md does not say, so this test states its reading.
  const levelBarDrag6 = (travel: SteeringInput["travel"]): SteeringInput =>
    input({
      trackBar: { frameEnd: F, axleEnd: { y: 36 * IN, z: 0 } },
      dragLink: { pitmanEnd: { y: 0, z: 100 }, knuckleEnd: endAt({ y: 0, z: 100 }, 34 * IN, 6) },
      steeringArmLength: 6 * IN,
      travel,
    });

  it("REFERENCES: level lateral link, 34 in drag link at 6°, +4 in bump → 0.44 in mismatch, ≈ 4.2° on a 6 in arm", () => {
    const r = computeSteeringGeometry(levelBarDrag6({ bump: 4 * IN, droop: 0, step: 4 * IN }));
    const p = r.heave.at(-1)!;
    expect(p.travel).toBe(4 * IN);
    expect(Math.abs(Math.abs(p.dragLinkError) / IN - 0.44)).toBeLessThan(0.005);
    expect(Math.abs(Math.abs(p.wheelSteerDeg) - 4.2)).toBeLessThan(0.05);
    // Sign from the closed form: the axle moves −Δy_link, the drag link wants the arm at −Δy_drag.
    const expected = lateralShift(36 * IN, 0, 4 * IN) - lateralShift(34 * IN, 34 * IN * Math.sin(6 * RAD), 4 * IN);
    expect(p.dragLinkError).toBeCloseTo(expected, 9);
    expect(p.wheelSteerDeg).toBeCloseTo(Math.asin(expected / (6 * IN)) * DEG, 9);
  });

  it("REFERENCES: both links at 6°, 36 vs 34 in → 0.014 in (length mismatch is second order only)", () => {
    const r = computeSteeringGeometry(
      input({
        trackBar: { frameEnd: F, axleEnd: endAt(F, 36 * IN, 6) },
        dragLink: { pitmanEnd: { y: 0, z: 100 }, knuckleEnd: endAt({ y: 0, z: 100 }, 34 * IN, 6) },
        travel: { bump: 4 * IN, droop: 0, step: 4 * IN },
      }),
    );
    const p = r.heave.at(-1)!;
    expect(Math.abs(Math.abs(p.dragLinkError) / IN - 0.014)).toBeLessThan(0.0005);
    const expected =
      lateralShift(36 * IN, 36 * IN * Math.sin(6 * RAD), 4 * IN) -
      lateralShift(34 * IN, 34 * IN * Math.sin(6 * RAD), 4 * IN);
    expect(p.dragLinkError).toBeCloseTo(expected, 9);
  });
});

describe("parallel links (REFERENCES.md practice/calc: parallel and equal → no steer)", () => {
  it.each([0, 6, -10, 25])("equal parallel links at %d° give zero steer over the whole range (1e-9)", (deg) => {
    const F = { y: -480, z: 240 };
    const P = { y: -455, z: 95 };
    const v = endAt({ y: 0, z: 0 }, 920, deg);
    const r = computeSteeringGeometry(
      input({
        trackBar: { frameEnd: F, axleEnd: { y: F.y + v.y, z: F.z + v.z } },
        dragLink: { pitmanEnd: P, knuckleEnd: { y: P.y + v.y, z: P.z + v.z } },
        travel: { bump: 150, droop: 150, step: 1 },
      }),
    );
    expect(r.heave).toHaveLength(301);
    for (const p of r.heave) {
      expect(Math.abs(p.dragLinkError)).toBeLessThan(1e-9);
      expect(Math.abs(p.wheelSteerDeg)).toBeLessThan(1e-9);
    }
    // The axle itself does move sideways; only the mismatch vanishes.
    expect(Math.abs(r.heave[0]!.axleShift)).toBeGreaterThan(1);
    expect(Math.abs(r.angleDifferenceDeg)).toBeLessThan(1e-9);
  });
});

describe("first order: d ≈ h·(tan θ_link − tan θ_drag) (DESIGN.md item 1; REFERENCES.md with d taken the other way)", () => {
  it("small travel matches the slope difference from the coordinates", () => {
    const g = input();
    const mLink = (g.trackBar.axleEnd.z - g.trackBar.frameEnd.z) / (g.trackBar.axleEnd.y - g.trackBar.frameEnd.y);
    const mDrag = (g.dragLink.knuckleEnd.z - g.dragLink.pitmanEnd.z) / (g.dragLink.knuckleEnd.y - g.dragLink.pitmanEnd.y);
    const h = 0.5;
    const r = computeSteeringGeometry({ ...g, travel: { bump: h, droop: h, step: h } });
    for (const p of [r.heave[0]!, r.heave[2]!]) {
      const first = p.travel * (mLink - mDrag);
      expect(Math.abs(first)).toBeGreaterThan(0.01); // the check is not vacuous
      expect(Math.abs(p.dragLinkError - first)).toBeLessThan(0.01 * Math.abs(first));
    }
    // tan of the reported angles are those same slopes.
    expect(Math.tan(r.trackBarAngleDeg * RAD)).toBeCloseTo(mLink, 12);
    expect(Math.tan(r.dragLinkAngleDeg * RAD)).toBeCloseTo(mDrag, 12);
  });
});

describe("angles", () => {
  it("atan2(dz, dy) folded to (−90, 90]: either end first gives the same, sign kept", () => {
    const a = { y: 0, z: 0 };
    const b = { y: 1000, z: -50 };
    expect(linkAngleDeg(a, b)).toBeCloseTo(Math.atan(-0.05) * DEG, 12);
    expect(linkAngleDeg(b, a)).toBeCloseTo(Math.atan(-0.05) * DEG, 12);
    expect(linkAngleDeg({ y: 0, z: 0 }, { y: 0, z: 10 })).toBe(90);
    expect(linkAngleDeg({ y: 0, z: 10 }, { y: 0, z: 0 })).toBe(90);
  });

  it("angleDifferenceDeg = drag − lateral link, folded like a line angle", () => {
    const r = computeSteeringGeometry(input());
    expect(r.angleDifferenceDeg).toBeCloseTo(r.dragLinkAngleDeg - r.trackBarAngleDeg, 12);
    // Lines at +80° and −80° are 20° apart, not 160°.
    const steep = computeSteeringGeometry(
      input({
        trackBar: { frameEnd: { y: 0, z: 0 }, axleEnd: endAt({ y: 0, z: 0 }, 1000, 80) },
        dragLink: { pitmanEnd: { y: 0, z: 0 }, knuckleEnd: endAt({ y: 0, z: 0 }, 1000, -80) },
        travel: { bump: 1, droop: 1, step: 1 },
        steeringArmLength: 1000,
      }),
    );
    expect(steep.angleDifferenceDeg).toBeCloseTo(20, 9);
  });
});

describe("sweep points", () => {
  it("runs from −droop to +bump on multiples of step, ride height included", () => {
    const r = computeSteeringGeometry(input({ travel: { bump: 50, droop: 30, step: 20 } }));
    expect(r.heave.map((p) => p.travel)).toEqual([-30, -20, 0, 20, 40, 50]);
  });

  it("does not duplicate an end point that is a multiple of a decimal step", () => {
    const r = computeSteeringGeometry(input({ travel: { bump: 0.3, droop: 0.3, step: 0.1 } }));
    const t = r.heave.map((p) => p.travel);
    expect(t).toHaveLength(7);
    [-0.3, -0.2, -0.1, 0, 0.1, 0.2, 0.3].forEach((v, i) => expect(t[i]).toBeCloseTo(v, 12));
  });

  it("no travel gives the single ride-height point", () => {
    const r = computeSteeringGeometry(input({ travel: { bump: 0, droop: 0, step: 5 } }));
    expect(r.heave).toEqual([{ travel: 0, axleShift: 0, dragLinkError: 0, wheelSteerDeg: 0 }]);
  });
});

describe("steering wheel and worst case", () => {
  it("steering-wheel angle = wheel steer × ratio (16:1 is common practice), absent without a ratio", () => {
    const withRatio = computeSteeringGeometry(input({ steeringRatio: 16 }));
    for (const p of withRatio.heave) expect(p.steeringWheelDeg).toBeCloseTo(p.wheelSteerDeg * 16, 12);
    expect(withRatio.worst.overall.steeringWheelDeg).toBeCloseTo(withRatio.worst.overall.wheelSteerDeg * 16, 12);
    const without = computeSteeringGeometry(input());
    expect(without.heave.some((p) => "steeringWheelDeg" in p)).toBe(false);
    expect("steeringWheelDeg" in without.worst.overall).toBe(false);
  });

  it("worst heave is the point of largest |steer|, sign kept; roll null without a roll sweep", () => {
    const r = computeSteeringGeometry(input());
    const byHand = r.heave.reduce((a, b) => (Math.abs(b.wheelSteerDeg) > Math.abs(a.wheelSteerDeg) ? b : a));
    expect(r.worst.heave).toEqual({
      travel: byHand.travel,
      wheelSteerDeg: byHand.wheelSteerDeg,
      dragLinkError: byHand.dragLinkError,
    });
    expect(Math.abs(r.worst.heave.wheelSteerDeg)).toBeGreaterThan(0.1);
    expect(r.roll).toEqual([]);
    expect(r.worst.roll).toBeNull();
    expect(r.worst.overall).toMatchObject({ source: "heave", at: byHand.travel, wheelSteerDeg: byHand.wheelSteerDeg });
  });

  it("overall picks the roll sweep when it steers more", () => {
    // Equal parallel links: no heave steer at all, but roll about a centre far below the links steers.
    const F = { y: -450, z: 300 };
    const P = { y: -450, z: 200 };
    const r = computeSteeringGeometry(
      input({
        trackBar: { frameEnd: F, axleEnd: { y: 450, z: 300 } },
        dragLink: { pitmanEnd: P, knuckleEnd: { y: 450, z: 200 } },
        roll: { maxDeg: 4, stepDeg: 1 },
      }),
    );
    expect(r.worst.roll).not.toBeNull();
    expect(Math.abs(r.worst.roll!.wheelSteerDeg)).toBeGreaterThan(Math.abs(r.worst.heave.wheelSteerDeg));
    expect(r.worst.overall.source).toBe("roll");
    expect(r.worst.overall.at).toBe(r.worst.roll!.rollDeg);
  });
});

describe("roll", () => {
  // Independent check: rotate with cos/sin directly and solve each link with the plain square root.
  function direct(g: SteeringInput, phiDeg: number) {
    const t = phiDeg * RAD;
    const rot = (p: { y: number; z: number }) => {
      const y = p.y - g.axleCenter.y;
      const z = p.z - g.axleCenter.z;
      // Counter-clockwise seen from the front: +y side rises.
      return { y: g.axleCenter.y + y * Math.cos(t) - z * Math.sin(t), z: g.axleCenter.z + y * Math.sin(t) + z * Math.cos(t) };
    };
    const { frameEnd: F, axleEnd: A } = g.trackBar;
    const { pitmanEnd: P, knuckleEnd: K } = g.dragLink;
    const L = Math.hypot(A.y - F.y, A.z - F.z);
    const Ld = Math.hypot(K.y - P.y, K.z - P.z);
    const Ar = rot(A);
    const s = F.y + Math.sign(A.y - F.y) * Math.sqrt(L * L - (Ar.z - F.z) ** 2) - Ar.y;
    const Kr = rot(K);
    const d = P.y + Math.sign(K.y - P.y) * Math.sqrt(Ld * Ld - (Kr.z - P.z) ** 2) - (Kr.y + s);
    return { s, d };
  }

  it("matches the direct rotate-and-solve at every step, in both directions", () => {
    const g = input({ axleCenter: { y: 30, z: -20 }, roll: { maxDeg: 8, stepDeg: 2 } });
    const r = computeSteeringGeometry(g);
    expect(r.roll.map((p) => p.rollDeg)).toEqual([-8, -6, -4, -2, 0, 2, 4, 6, 8]);
    for (const p of r.roll) {
      const e = direct(g, p.rollDeg);
      expect(p.axleShift).toBeCloseTo(e.s, 8);
      expect(p.dragLinkError).toBeCloseTo(e.d, 8);
      expect(p.wheelSteerDeg).toBeCloseTo(Math.asin(e.d / g.steeringArmLength) * DEG, 8);
    }
    expect(r.roll[4]).toEqual({ rollDeg: 0, axleShift: 0, dragLinkError: 0, wheelSteerDeg: 0 });
    expect(Math.abs(r.roll[0]!.wheelSteerDeg)).toBeGreaterThan(0.1);
  });
});

describe("candidate holes", () => {
  const g = input();
  const { frameEnd: F, axleEnd: A } = g.trackBar;
  const { pitmanEnd: P, knuckleEnd: K } = g.dragLink;
  // Closed form: the axle-end height on the line y = A.y that gives the lateral link the drag link's slope.
  const zPar = F.z + ((A.y - F.y) * (K.z - P.z)) / (K.y - P.y);

  it("puts the parallel hole first and ranks by |worst steer|", () => {
    const offsets = [-40, -20, 20, 40];
    const r = computeSteeringGeometry({
      ...g,
      candidateHoles: [
        { y: A.y, z: A.z, label: "current" },
        ...offsets.map((o) => ({ y: A.y, z: zPar + o, label: `${o}` })),
        { y: A.y, z: zPar, label: "parallel" },
      ],
    });
    const holes = r.holes!;
    expect(holes[0]!.label).toBe("parallel");
    expect(holes[0]!.trackBarAngleDeg).toBeCloseTo(r.dragLinkAngleDeg, 9);
    expect(holes.map((h) => h.rank)).toEqual([1, 2, 3, 4, 5, 6]);
    for (let i = 1; i < holes.length; i++) {
      expect(Math.abs(holes[i]!.worstWheelSteerDeg)).toBeGreaterThanOrEqual(Math.abs(holes[i - 1]!.worstWheelSteerDeg));
    }
    expect(r.parallelHeightZ).toBeCloseTo(zPar, 9);
  });

  it("each hole's worst steer equals a full run with that hole as the axle end", () => {
    const r = computeSteeringGeometry({ ...g, candidateHoles: [{ y: A.y + 15, z: A.z + 35 }, { y: A.y, z: A.z - 30 }] });
    expect(r.holes!.map((h) => h.label).sort()).toEqual(["H1", "H2"]);
    for (const h of r.holes!) {
      const full = computeSteeringGeometry({ ...g, trackBar: { frameEnd: F, axleEnd: { y: h.y, z: h.z } } });
      expect(h.worstWheelSteerDeg).toBe(full.worst.heave.wheelSteerDeg);
      expect(h.trackBarAngleDeg).toBe(full.trackBarAngleDeg);
    }
  });

  it("hole range lies on the axle end's vertical line by default, labels R1… from the bottom", () => {
    const r = computeSteeringGeometry({ ...g, holeRange: { zMin: zPar - 60, zMax: zPar + 60, pitch: 20 } });
    const holes = r.holes!;
    expect(holes).toHaveLength(7);
    expect(holes.every((h) => h.y === A.y)).toBe(true);
    expect(holes[0]!.label).toBe("R4");
    expect(holes[0]!.z).toBeCloseTo(zPar, 9);
  });

  it("hole range on another line: parallel height on that line", () => {
    const y = A.y - 40;
    const r = computeSteeringGeometry({ ...g, holeRange: { zMin: 0, zMax: 200, pitch: 10, y } });
    expect(r.holes!.every((h) => h.y === y)).toBe(true);
    expect(r.parallelHeightZ).toBeCloseTo(F.z + ((y - F.y) * (K.z - P.z)) / (K.y - P.y), 9);
  });

  it("frame-end variant: the candidates move the frame end", () => {
    const zFrame = A.z - ((A.y - F.y) * (K.z - P.z)) / (K.y - P.y);
    const r = computeSteeringGeometry({
      ...g,
      candidateEnd: "frame",
      candidateHoles: [-30, 30, 0].map((o) => ({ y: F.y, z: zFrame + o, label: o === 0 ? "parallel" : `${o}` })),
    });
    expect(r.parallelHeightZ).toBeCloseTo(zFrame, 9);
    expect(r.holes![0]!.label).toBe("parallel");
    expect(r.holes![0]!.trackBarAngleDeg).toBeCloseTo(r.dragLinkAngleDeg, 9);
  });

  it("common practice (REFERENCES.md): raising the drag link end calls for raising the axle end about as much", () => {
    const raised = { ...g, dragLink: { pitmanEnd: P, knuckleEnd: { y: K.y, z: K.z + 100 } } };
    const r = computeSteeringGeometry({ ...raised, holeRange: { zMin: A.z - 50, zMax: A.z + 250, pitch: 5 } });
    // Rise measured from the parallel height before the flip.
    const rise = r.holes![0]!.z - zPar;
    expect(rise).toBeGreaterThan(85);
    expect(rise).toBeLessThan(120);
  });

  it("no holes key without candidates", () => {
    expect("holes" in computeSteeringGeometry(g)).toBe(false);
  });
});

describe("impossible geometry throws GeometryError (HTTP 422)", () => {
  const cases: [string, SteeringInput, GeometryErrorReason][] = [
    ["zero-length lateral link", input({ trackBar: { frameEnd: { y: 5, z: 5 }, axleEnd: { y: 5, z: 5 } } }), "zero_length_link"],
    ["zero-length drag link", input({ dragLink: { pitmanEnd: { y: 1, z: 2 }, knuckleEnd: { y: 1, z: 2 } } }), "zero_length_link"],
    ["vertical lateral link", input({ trackBar: { frameEnd: { y: 0, z: 0 }, axleEnd: { y: 0, z: 300 } } }), "vertical_link"],
    [
      "lateral link too short for the travel (√ of a negative)",
      input({ trackBar: { frameEnd: { y: 0, z: 0 }, axleEnd: { y: 100, z: 0 } }, travel: { bump: 150, droop: 0, step: 10 } }),
      "unreachable",
    ],
    [
      "drag link too short for the travel",
      input({ dragLink: { pitmanEnd: { y: 0, z: 0 }, knuckleEnd: { y: 80, z: 0 } } }),
      "unreachable",
    ],
    [
      "roll the lateral link cannot follow",
      input({
        trackBar: { frameEnd: { y: 100, z: 0 }, axleEnd: { y: 300, z: 0 } },
        axleCenter: { y: 0, z: 0 },
        travel: { bump: 0, droop: 0, step: 1 },
        roll: { maxDeg: 45, stepDeg: 5 },
      }),
      "unreachable",
    ],
    ["|d / r| > 1", input({ steeringArmLength: 1 }), "steer_out_of_range"],
    ["steering arm length 0", input({ steeringArmLength: 0 }), "bad_steering_arm"],
    ["steering arm length < 0", input({ steeringArmLength: -5 }), "bad_steering_arm"],
    ["travel step 0", input({ travel: { bump: 10, droop: 10, step: 0 } }), "bad_step"],
    ["travel step < 0", input({ travel: { bump: 10, droop: 10, step: -1 } }), "bad_step"],
    ["too many heave points", input({ travel: { bump: 100, droop: 100, step: 0.01 } }), "too_many_points"],
    ["too many roll points", input({ roll: { maxDeg: 45, stepDeg: 0.001 } }), "too_many_points"],
    ["NaN coordinate", input({ axleCenter: { y: Number.NaN, z: 0 } }), "non_finite_input"],
    ["hole on the frame end", input({ candidateHoles: [{ y: -450, z: 200 }] }), "zero_length_link"],
    ["too many holes", input({ holeRange: { zMin: 0, zMax: 1000, pitch: 1 } }), "too_many_points"],
  ];

  it.each(cases)("%s", (_name, g, reason) => {
    expect(reasonOf(() => computeSteeringGeometry(g))).toBe(reason);
  });

  it("carries a code the API can map without the class, and a readable message", () => {
    let caught: unknown;
    try {
      computeSteeringGeometry(cases[3]![1]);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(Error);
    expect(isGeometryError(caught)).toBe(true);
    expect((caught as GeometryError).code).toBe("impossible_geometry");
    expect((caught as GeometryError).message).toMatch(/lateral link cannot reach at travel \+110 mm/);
    expect(isGeometryError(new Error("x"))).toBe(false);
  });
});

describe("zod input schema", () => {
  const valid = {
    ...input({ steeringRatio: 16, roll: { maxDeg: 6, stepDeg: 1 } }),
    candidateHoles: [{ y: 450, z: 150, label: "upper" }, { y: 450, z: 120 }],
    holeRange: { zMin: 100, zMax: 200, pitch: 12.7 },
    candidateEnd: "axle" as const,
  };
  const paths = (v: unknown) => {
    const r = steeringInputSchema.safeParse(v);
    expect(r.success).toBe(false);
    return r.error!.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
  };

  it("accepts a full input unchanged and strips unknown keys", () => {
    expect(steeringInputSchema.parse(valid)).toEqual(valid);
    expect(steeringInputSchema.parse({ ...valid, note: "extra" })).toEqual(valid);
    expect(() => computeSteeringGeometry(steeringInputSchema.parse(valid))).not.toThrow();
  });

  it("names the missing field and says what it is", () => {
    const bad = { ...valid, trackBar: { ...valid.trackBar, axleEnd: { y: 450 } } };
    expect(paths(bad)).toEqual([{ path: "trackBar.axleEnd.z", message: "lateral link axle end z must be a number (mm)" }]);
  });

  it.each([
    ["travel.step", { travel: { bump: 10, droop: 10, step: 0 } }, /greater than 0/],
    ["travel.droop", { travel: { bump: 10, droop: -10, step: 1 } }, /0 or more/],
    ["travel.step", { travel: { bump: 1000, droop: 1000, step: 0.1 } }, /20001 points.*10001/],
    ["steeringArmLength", { steeringArmLength: "150" }, /must be a number/],
    ["steeringArmLength", { steeringArmLength: -1 }, /greater than 0/],
    ["steeringRatio", { steeringRatio: 0 }, /greater than 0/],
    ["roll.stepDeg", { roll: { maxDeg: 5, stepDeg: 0 } }, /greater than 0/],
    ["roll.maxDeg", { roll: { maxDeg: 90, stepDeg: 1 } }, /at most 45/],
    ["holeRange.zMax", { holeRange: { zMin: 200, zMax: 100, pitch: 10 } }, /below the lowest/],
    ["holeRange.pitch", { holeRange: { zMin: 0, zMax: 1000, pitch: 0.5 } }, /more than 500 holes/],
    ["axleCenter.y", { axleCenter: { y: Number.POSITIVE_INFINITY, z: 0 } }, /must be a number/],
    ["trackBar.frameEnd.y", { trackBar: { frameEnd: { y: 1e9, z: 0 }, axleEnd: { y: 1, z: 0 } } }, /within ±10000 mm/],
    ["candidateEnd", { candidateEnd: "middle" }, /"axle" or "frame"/],
    ["candidateHoles.0.label", { candidateHoles: [{ y: 1, z: 2, label: " " }] }, /must not be empty/],
  ])("rejects %s", (path, patch, message) => {
    const issues = paths({ ...valid, ...patch });
    expect(issues.map((i) => i.path)).toContain(path);
    expect(issues.find((i) => i.path === path)!.message).toMatch(message);
  });

  it("caps the number of candidate holes", () => {
    const many = Array.from({ length: 501 }, (_, i) => ({ y: 450, z: i }));
    expect(paths({ ...valid, holeRange: undefined, candidateHoles: many }).map((i) => i.path)).toEqual(["candidateHoles"]);
    const together = { ...valid, candidateHoles: many.slice(0, 495), holeRange: { zMin: 0, zMax: 100, pitch: 10 } };
    expect(paths(together).map((i) => i.path)).toEqual(["holeRange.pitch"]);
  });

  it("flattens to field errors for the API's { error: { fields } }", () => {
    const r = steeringInputSchema.safeParse({ ...valid, steeringArmLength: 0 });
    expect(z.flattenError(r.error!).fieldErrors).toEqual({ steeringArmLength: ["steering arm length must be greater than 0"] });
  });
});
