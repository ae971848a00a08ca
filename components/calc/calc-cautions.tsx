import { SafetyNote } from "@/components/safety-note";
import { HOT_WORK_CAUTIONS } from "@/components/safety-cautions";

// The cautions each calculator carries beside the shared safety note.
export const CALC_CAUTIONS = {
  steering: [
    "These parts steer and locate the axle: a bad weld or a wrong geometry can put a vehicle off the road. Have the result checked before the vehicle is driven.",
    "Figures are a front view at ride height. Caster, the drag link's fore-aft angle, tyre deflection and bushing compliance are not in them.",
    "Measure from one datum with the vehicle at ride height on level ground, and weight on the wheels, before cutting anything.",
    "After fitting: centre the steering wheel, check full lock both ways for binding and clearance, and road-test at low speed before normal use.",
  ],
  heatInput: [
    "Heat input is checked against the WPS the weld is made to; this screen does not know that range.",
    ...HOT_WORK_CAUTIONS.slice(1, 4),
  ],
  fillet: [
    "Weld metal only: the tube, bracket and frame (base metal, AISC 360-16 J4), fatigue and impact loads from off-road use are not checked.",
    "Axle housings and frames are loaded over and over: a static strength check is not a fatigue check. Follow the bracket maker's welding instructions.",
    "Heat on a housing tube can bend it and damage seals and bearings: weld in short alternating runs and let it cool.",
  ],
  coating: [
    "Coatings and solvents are flammable and give off harmful vapour: ventilate, wear the respirator the data sheet names, and keep sparks and hot work away.",
    "Never weld or cut through a coating: remove it from the heat zone first (toxic fumes).",
    "The coating maker's data sheet sets the limits (surface temperature, humidity, film thickness); it governs over the general rules used here.",
  ],
  units: ["Check the unit on every figure you carry over: a torque or a length in the wrong unit is a failure waiting to happen."],
} as const;

export type CalcCautionKind = keyof typeof CALC_CAUTIONS;

export function CalcCautions({ kind, title = "Cautions", note = true }: { kind: CalcCautionKind; title?: string; note?: boolean }) {
  return (
    <aside className="space-y-3" aria-label="Safety">
      {note ? <SafetyNote /> : null}
      <section className="rounded-lg border-2 border-graphite-900 bg-white p-4" aria-labelledby={`cautions-${kind}`} data-testid="calc-cautions">
        <h2 id={`cautions-${kind}`} className="flex items-center gap-2 font-bold">
          <span aria-hidden="true" className="inline-flex h-6 w-6 items-center justify-center rounded-sm bg-primer-500 text-graphite-950">!</span>
          {title}
        </h2>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-graphite-900">
          {CALC_CAUTIONS[kind].map((c) => <li key={c}>{c}</li>)}
        </ul>
      </section>
    </aside>
  );
}
