import type { UnitSystem } from "@/lib/units";
import { CAPTURE_LABELS, HAZARD_LABELS, QUANTITY_LABELS, SIGNER_LABELS } from "@/lib/procedures/labels";
import type { Step } from "@/lib/procedures/schema";
import { describeTolerance, describeTorque, fmtValue } from "./format";

// The kind-specific figures of a step, as a shop reads them.
export function stepFacts(step: Step, system: UnitSystem): [string, string][] {
  const facts: [string, string][] = [["Signed by", SIGNER_LABELS[step.signedBy]]];
  if (step.photos.required) facts.push(["Photos", `at least ${step.photos.min}`]);
  switch (step.kind) {
    case "measure":
      facts.push([QUANTITY_LABELS[step.quantity], describeTolerance(step, system)]);
      break;
    case "caution":
      facts.push(["Hazards", step.hazards.map((h) => HAZARD_LABELS[h]).join(", ")]);
      facts.push(["Signer acknowledges", step.acknowledgement]);
      break;
    case "weld":
      facts.push(["Joint", `${step.jointId}, ${step.jointType}`]);
      facts.push(["Size × length", `${fmtValue("length", step.sizeMm, system)} × ${fmtValue("length", step.lengthMm, system)}`]);
      facts.push(["Position, process", `${step.position}, ${step.process}`]);
      facts.push(["WPS", step.wpsRef]);
      facts.push(["Filler", step.filler]);
      facts.push(["Min preheat", fmtValue("temperature", step.minPreheatC, system)]);
      break;
    case "hold":
      facts.push(["Inspector checks", step.inspection]);
      break;
    case "torque":
      facts.push(["Fastener", step.fastener]);
      facts.push(["Torque", `${describeTorque(step)} ± ${step.tolerancePct} %`]);
      if (step.pattern) facts.push(["Pattern", step.pattern]);
      break;
    case "coating":
      facts.push(["Surface preparation", step.surfacePrep]);
      facts.push(["Product", step.product]);
      facts.push(["Dew-point margin", `steel at least ${step.dewPointMarginC} °C above the dew point`]);
      facts.push(["DFT", `${fmtValue("thickness", step.dftMinUm, system)} to ${fmtValue("thickness", step.dftMaxUm, system)}`]);
      break;
    case "geometry":
      facts.push(["Capture", CAPTURE_LABELS[step.capture]]);
      break;
    default:
      break;
  }
  return facts;
}

export function StepFacts({ step, system }: { step: Step; system: UnitSystem }) {
  return (
    <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[11rem_1fr]">
      {stepFacts(step, system).map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="font-semibold text-graphite-700">{k}</dt>
          <dd>{v}</dd>
        </div>
      ))}
    </dl>
  );
}
