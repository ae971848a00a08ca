// Where a weld joint stands, from its passes, sign-offs, inspections and nonconformances (lib/jobs/joint),
// and what that means for signing (lib/jobs/readiness) and for the hold point after it (lib/jobs/assemble).
import { describe, expect, it } from "vitest";
import { holdWaitingReason } from "@/lib/jobs/assemble";
import { inspectionSeparation, jointView } from "@/lib/jobs/joint";
import { materialsInUse } from "@/lib/jobs/materials";
import { stepReadiness } from "@/lib/jobs/readiness";
import { weldPassSchema } from "@/lib/jobs/schemas";
import type { InspectionView, NonconformanceView, PassView, SignOffView } from "@/lib/jobs/record";
import type { Step } from "@/lib/procedures/schema";

const STEP = "step-1";
const weld = { key: "w", kind: "weld", title: "W1", instructions: "", signedBy: "welder", photos: { required: false, min: 0 }, jointId: "W1", jointType: "fillet", sizeMm: 6, lengthMm: 80, position: "2F", process: "GMAW", wpsRef: "GUS-GMAW-02", filler: "ER70S-6", minPreheatC: 10 } as Step;

function pass(n: number, round: number, over: Partial<PassView> = {}): PassView {
  return {
    id: `p${n}`, stepId: STEP, passNumber: n, welder: { id: "mick", name: "Mick" }, process: "GMAW", volts: 19, amps: 140, travelSpeedMmPerMin: 300, travelSpeedUnit: "mm/min",
    preheatC: 20, interpassC: null, fillerLot: "L1", arcEnergyKJPerMm: 0.532, heatInputKJPerMm: 0.4256, recordedAt: `2026-11-0${n}T10:00:00.000Z`, removed: false, round,
    position: "2F", fillerClassification: "ER70S-6", wps: { revisionId: "r", reference: "GUS-GMAW-02", number: 1 }, heatInputMethod: "voltage-current", beadLengthMm: null, arcTimeS: null,
    machineEnergyKJ: null, machinePowerW: null, jPerIn: 13513, findings: [], outOfRange: false, override: null, ...over,
  };
}
function performed(round: number): SignOffView {
  return { id: `so-p${round}`, stepId: STEP, nonconformanceId: null, userId: "mick", printedName: "Mick", role: "welder", meaning: "performed", signedAt: `2026-11-0${round}T11:00:00.000Z`, contentHash: "a".repeat(64), amendsSignOffId: null, reason: null, value: {}, round };
}
function inspection(round: number, decision: "accepted" | "rejected"): InspectionView {
  return {
    id: `i${round}`, stepId: STEP, round, criteria: "aws-d1.1-static", observations: {} as never, items: [], judged: decision === "accepted" ? "accept" : "reject", decision, notes: "", photoIds: ["ph"],
    inspector: { id: "ines", name: "Ines" }, signOffId: `so-i${round}`, inspectedAt: `2026-11-0${round}T12:00:00.000Z`,
  };
}
const view = (passes: PassView[], signOffs: SignOffView[], inspections: InspectionView[], ncs: NonconformanceView[] = []) =>
  jointView({ stepId: STEP, jointId: "W1", passes, signOffs, inspections, nonconformances: ncs });

describe("weld joint rounds", () => {
  it("welding → waiting for inspection → repair after a rejection → accepted, with every round kept in order", () => {
    expect(view([], [], []).state).toBe("welding");
    expect(view([pass(1, 1)], [performed(1)], [])).toMatchObject({ state: "awaiting_inspection", round: 1 });
    const repair = view([pass(1, 1)], [performed(1)], [inspection(1, "rejected")]);
    expect(repair).toMatchObject({ state: "repair", round: 2 });
    expect(repair.rounds.map((r) => [r.round, r.inspection?.decision ?? null, r.passes.length])).toEqual([[1, "rejected", 1], [2, null, 0]]);
    const done = view([pass(1, 1), pass(2, 2)], [performed(1), performed(2)], [inspection(1, "rejected"), inspection(2, "accepted")]);
    expect(done).toMatchObject({ state: "accepted", round: 2 });
    expect(done.rounds.map((r) => r.performed?.id)).toEqual(["so-p1", "so-p2"]);
  });

  it("nobody inspects a joint they put a pass on, even one struck out later", () => {
    const j = view([pass(1, 1), pass(2, 1, { welder: { id: "priya", name: "Priya" }, removed: true })], [performed(1)], []);
    expect(inspectionSeparation(j, "priya")).toMatch(/nobody inspects their own weld/);
    expect(inspectionSeparation(j, "ines")).toBeNull();
  });

  it("an out-of-range pass is covered by a lead's override or by a nonconformance raised after it and dispositioned", () => {
    const flagged = pass(1, 1, { outOfRange: true, findings: [{ field: "volts", value: 24, unit: "V", max: 21, ok: false, message: "Voltage 24 V is above the WPS maximum of 21 V." }] });
    expect(view([flagged], [], []).uncovered).toEqual([{ passNumber: 1, messages: ["Voltage 24 V is above the WPS maximum of 21 V."] }]);
    expect(view([{ ...flagged, override: { reason: "PQR covers it", by: { id: "nell", name: "Nell" }, at: "2026-11-01T10:30:00.000Z" } }], [], []).uncovered).toEqual([]);
    const nc = (raisedAt: string, decided: boolean): NonconformanceView => ({
      id: "nc", number: 1, stepId: STEP, stepKey: "w", stepTitle: "W1", description: "High volts", proposedDisposition: "use_as_is", observed: null, raisedBy: { id: "mick", name: "Mick" }, raisedAt, photoIds: [],
      disposition: decided ? { disposition: "use_as_is", notes: "", decidedBy: { id: "nell", name: "Nell" }, decidedAt: raisedAt, signOffId: "so-nc", contentHash: "c".repeat(64) } : null,
    });
    expect(view([flagged], [], [], [nc("2026-11-01T11:00:00.000Z", true)]).uncovered).toEqual([]);
    expect(view([flagged], [], [], [nc("2026-11-01T11:00:00.000Z", false)]).uncovered).toHaveLength(1);
    // A nonconformance decided before the pass was welded says nothing about it.
    expect(view([flagged], [], [], [nc("2026-10-31T11:00:00.000Z", true)]).uncovered).toHaveLength(1);
  });
});

describe("signing a weld round", () => {
  const facts = (joint: ReturnType<typeof view>, passes: PassView[]) => stepReadiness({ spec: weld, value: {}, photoCount: 0, passes, ncs: [], joint });

  it("a round with passes inside their WPS can be signed; an uncovered out-of-range pass blocks with the finding", () => {
    expect(facts(view([pass(1, 1)], [], []), [pass(1, 1)]).canSign).toBe(true);
    const flagged = pass(1, 1, { outOfRange: true, findings: [{ field: "amps", value: 180, unit: "A", max: 165, ok: false, message: "Current 180 A is above the WPS maximum of 165 A." }] });
    const r = facts(view([flagged], [], []), [flagged]);
    expect(r.canSign).toBe(false);
    expect(r.reasons.join(" ")).toMatch(/Pass 1 is outside its WPS \(Current 180 A is above the WPS maximum of 165 A\.\): raise a nonconformance, or a lead overrides it/);
  });

  it("a signed round waits for the inspector; a repair round asks for its passes", () => {
    const waiting = facts(view([pass(1, 1)], [performed(1)], []), [pass(1, 1)]);
    expect(waiting.canSign).toBe(false);
    expect(waiting.reasons).toContain("The joint is signed and waits for the inspector.");
    const repair = facts(view([pass(1, 1)], [performed(1)], [inspection(1, "rejected")]), []);
    expect(repair.reasons).toContain("Record the repair passes of round 2.");
  });

  it("a hold point after an unaccepted joint names the joint", () => {
    const j = view([pass(1, 1)], [performed(1)], []);
    expect(holdWaitingReason([{ kind: "weld", title: "W1" }], new Map([[STEP, j]]), [STEP])).toBe("Every weld before a hold point is accepted first: W1 is not accepted yet.");
    expect(holdWaitingReason([{ kind: "check", title: "Clean" }], new Map(), ["other"])).toMatch(/1 step is not signed yet \(first: "Clean"\)/);
  });
});

describe("materials in use", () => {
  it("keeps the last entry of each correction chain and leaves out withdrawn ones", () => {
    const row = (id: string, heatNumber: string, correctsId: string | null = null, withdrawn = false) => ({ id, kind: "base", description: "Plate", specification: "", heatNumber, certificate: "", correctsId, withdrawn });
    const rows = [row("a", "HT 1"), row("b", "HT 2", "a"), row("c", "LOT 9"), row("d", "LOT 9", "c", true)];
    expect(materialsInUse(rows).map((m) => m.heatNumber)).toEqual(["HT 2"]);
  });
});

describe("what a weld pass entry must say", () => {
  const base = { clientKey: "pass-key-0001", volts: 19, amps: 140, preheatC: 20, fillerLot: "LOT 1" };
  const issues = (body: Record<string, unknown>) => {
    const r = weldPassSchema.safeParse({ ...base, ...body });
    return r.success ? [] : r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
  };
  it("travel speed, or bead length and arc time (ASME IX QW-409.1(a)); never both, never neither", () => {
    expect(issues({ travelSpeed: { value: 300, unit: "mm/min" } })).toEqual([]);
    expect(issues({ beadLength: { value: 100, unit: "mm" }, arcTimeS: 20 })).toEqual([]);
    expect(issues({})).toEqual(["travelSpeed: Enter the travel speed, or the bead length and the arc time."]);
    expect(issues({ travelSpeed: { value: 300, unit: "mm/min" }, beadLength: { value: 100, unit: "mm" }, arcTimeS: 20 })).toEqual(["beadLength: Give the travel speed or the bead length and arc time, not both."]);
  });
  it("a machine reading (QW-409.1(c)) needs the bead length; average power also the arc time; not both readings", () => {
    expect(issues({ travelSpeed: { value: 300, unit: "mm/min" }, machineEnergyKJ: 60 })).toEqual(["beadLength: A reading from the machine needs the bead length it was welded over."]);
    expect(issues({ travelSpeed: { value: 300, unit: "mm/min" }, beadLength: { value: 100, unit: "mm" }, machinePowerW: 2660 })).toEqual(["arcTimeS: Average power needs the arc time."]);
    expect(issues({ beadLength: { value: 100, unit: "mm" }, arcTimeS: 20, machineEnergyKJ: 60, machinePowerW: 2660 })).toEqual(["machinePowerW: Give the machine's arc energy or its average power, not both."]);
  });
});
