"use client";
import { useState } from "react";
import { exampleSteeringForm, type SteeringFormState } from "@/components/calc/steering-request";
import type { UnitSystem } from "@/lib/units";
import { SaveToJob } from "./save-to-job";
import { SteeringCalculator } from "./steering-calculator";

// The calculator, and for those who may write to a job's checklist, the panel that saves the layout there.
export function SteeringWorkbench({ initialUnits, canSave }: { initialUnits: UnitSystem; canSave: boolean }) {
  const [state, setState] = useState<SteeringFormState>(() => exampleSteeringForm(initialUnits));
  return (
    <>
      <SteeringCalculator initialUnits={initialUnits} initial={state} onStateChange={setState} />
      {canSave ? <SaveToJob state={state} /> : null}
    </>
  );
}
