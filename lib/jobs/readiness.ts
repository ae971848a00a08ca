// Whether a step can be signed, and why not. One pure function, used by the API (which enforces it) and
// by the runner (which explains it before anyone types a PIN). Job-level rules (hold points, order,
// roles, separation of duties) live in ./state and the server.
import { checkDewPoint, evaluateDftArea, SPOTS_PER_AREA, MIN_READINGS_PER_SPOT, type DewPointResult, type DftAreaResult } from "@/lib/coating";
import type { Step } from "@/lib/procedures/schema";
import { canonicalJson } from "@/lib/seal/canonical-json";
import { requiredCaptures } from "./captures";
import { DISPOSITION_LABELS, type DispositionName, type JointState } from "./labels";
import { measureVerdict, torqueVerdict, type Verdict } from "./tolerance";
import type { CautionValue, CheckValue, CoatingValue, GeometryValue, MeasureValue, TorqueValue } from "./values";

export type StepNc = { number: number; disposition: DispositionName | null; observed: unknown };
export type StepFacts = {
  spec: Step;
  value: Record<string, unknown> | null;
  photoCount: number;
  /** passes not struck out (weld steps: of the joint's current round) */
  passes: { preheatC: number }[];
  ncs: StepNc[];
  /** weld steps: the joint's state and its out-of-range passes still to be covered */
  joint?: JointFacts | undefined;
};

/** What readiness needs of a weld joint (the record's JointView carries these and more). */
export type JointFacts = {
  state: JointState;
  round: number;
  /** out-of-range passes of the current round with neither an override nor a dispositioned NC */
  uncovered: { passNumber: number; messages: string[] }[];
};

export type Readiness = {
  /** fail: a reading is out of tolerance; incomplete: something is missing; pass: complete and within limits */
  verdict: "pass" | "fail" | "incomplete";
  canSign: boolean;
  reasons: string[];
  /** nonconformances whose "use as is" lets this out-of-tolerance value be signed */
  acceptedUnder: number[];
  tolerance?: Verdict;
  dewPoint?: DewPointResult;
  dft?: DftAreaResult;
};

export function photosNeeded(spec: Step): number {
  const min = spec.photos.required ? spec.photos.min : 0;
  return spec.kind === "photo" ? Math.max(1, min) : min;
}

function sameValue(a: unknown, b: unknown): boolean {
  try {
    return canonicalJson(a ?? {}) === canonicalJson(b ?? {});
  } catch {
    return false;
  }
}

export function stepReadiness(f: StepFacts): Readiness {
  const reasons: string[] = [];
  const out: Readiness = { verdict: "pass", canSign: false, reasons, acceptedUnder: [] };
  const value = (f.value ?? {}) as Record<string, unknown>;
  let complete = true;
  let failed = false;
  let blocking = false; // a failure no disposition can override

  const spec = f.spec;
  switch (spec.kind) {
    case "check": {
      if ((value as CheckValue).confirmed !== true) {
        complete = false;
        reasons.push("Confirm the check is done.");
      }
      break;
    }
    case "caution": {
      const acked = new Set((value as CautionValue).acknowledged ?? []);
      const missing = spec.hazards.filter((h) => !acked.has(h));
      if (missing.length) {
        complete = false;
        reasons.push(`Acknowledge every hazard (${missing.length} left).`);
      }
      break;
    }
    case "measure": {
      const reading = (value as MeasureValue).reading;
      if (typeof reading !== "number") {
        complete = false;
        reasons.push("Enter the reading.");
      } else {
        out.tolerance = measureVerdict(spec, reading);
        if (!out.tolerance.ok) failed = true;
      }
      break;
    }
    case "torque": {
      const achieved = (value as TorqueValue).achievedNm;
      if (typeof achieved !== "number") {
        complete = false;
        reasons.push("Enter the achieved torque.");
      } else {
        out.tolerance = torqueVerdict(spec, achieved);
        if (!out.tolerance.ok) failed = true;
      }
      break;
    }
    case "coating": {
      const v = value as CoatingValue;
      if (v.airTempC === undefined || v.relativeHumidity === undefined || v.surfaceTempC === undefined) {
        complete = false;
        reasons.push("Enter air temperature, relative humidity and surface temperature.");
      } else {
        out.dewPoint = checkDewPoint({ airTempC: v.airTempC, relativeHumidity: v.relativeHumidity, surfaceTempC: v.surfaceTempC, requiredMarginC: spec.dewPointMarginC });
        if (!out.dewPoint.ok) {
          blocking = true;
          reasons.push(
            `Conditions fail: the surface is ${out.dewPoint.marginC.toFixed(1)} °C above the dew point; ${spec.dewPointMarginC} °C is needed. Wait, warm the part or dry the air, then measure again.`,
          );
        }
      }
      const spots = (v.dftSpots ?? []).filter((s) => s.length > 0);
      if (spots.length < SPOTS_PER_AREA || spots.some((s) => s.length < MIN_READINGS_PER_SPOT)) {
        complete = false;
        reasons.push(`Take ${SPOTS_PER_AREA} DFT spots of at least ${MIN_READINGS_PER_SPOT} readings each (SSPC-PA 2).`);
      } else {
        out.dft = evaluateDftArea({ specMin: spec.dftMinUm, specMax: spec.dftMaxUm }, spots);
        if (!out.dft.ok) failed = true;
      }
      break;
    }
    case "geometry": {
      const v = value as GeometryValue;
      for (const which of requiredCaptures(spec.capture)) {
        if (!v[which]?.results) {
          complete = false;
          reasons.push(`Capture the ${which === "before" ? "before" : "after"} geometry.`);
        }
      }
      break;
    }
    case "weld": {
      const joint = f.joint;
      if (joint?.state === "awaiting_inspection") {
        blocking = true;
        reasons.push(`${joint.round > 1 ? `Repair round ${joint.round}` : "The joint"} is signed and waits for the inspector.`);
      } else if (joint?.state === "accepted") {
        blocking = true;
        reasons.push("The joint is inspected and accepted.");
      } else if (f.passes.length === 0) {
        complete = false;
        reasons.push(joint && joint.round > 1 ? `Record the repair passes of round ${joint.round}.` : "Record at least one weld pass.");
      }
      for (const u of joint?.uncovered ?? []) {
        blocking = true;
        reasons.push(`Pass ${u.passNumber} is outside its WPS (${u.messages.join(" ")}): raise a nonconformance, or a lead overrides it with a reason.`);
      }
      const cold = f.passes.filter((p) => p.preheatC < spec.minPreheatC - 1e-9);
      if (cold.length) {
        blocking = true;
        reasons.push(`A pass was recorded below the minimum preheat of ${spec.minPreheatC} °C.`);
      }
      break;
    }
    case "photo":
    case "hold":
      break;
  }

  const open = f.ncs.filter((n) => n.disposition === null);
  const needed = photosNeeded(spec);
  if (f.photoCount < needed) {
    complete = false;
    reasons.push(needed === 1 ? "Take a photo." : `Take ${needed} photos (${f.photoCount} so far).`);
  }

  for (const n of open) reasons.push(`NC-${n.number} is open: a lead or inspector dispositions it before this step is signed.`);

  if (failed) {
    const accepted = f.ncs.filter((n) => n.disposition === "use_as_is" && sameValue(n.observed, f.value)).map((n) => n.number);
    out.acceptedUnder = accepted;
    if (accepted.length === 0 && open.length === 0) {
      const redo = f.ncs.filter((n) => n.disposition && n.disposition !== "use_as_is");
      reasons.push(
        redo.length
          ? `Still out of tolerance after ${DISPOSITION_LABELS[redo[redo.length - 1]!.disposition!].label.toLowerCase()}: measure again, or raise a new nonconformance.`
          : "Out of tolerance: it cannot be signed as passed. Raise a nonconformance.",
      );
    }
  }

  // Out of tolerance outranks "incomplete": the welder must see it before taking the last photo.
  out.verdict = failed ? "fail" : !complete ? "incomplete" : "pass";
  out.canSign = complete && !blocking && open.length === 0 && (!failed || out.acceptedUnder.length > 0);
  return out;
}
