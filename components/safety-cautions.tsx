// The usual cautions of hot work on a vehicle, shown on the bench and in procedures.
export const HOT_WORK_CAUTIONS = [
  "Vehicle on rated stands on firm ground, wheels chocked; never work under a vehicle held by a jack alone.",
  "Disconnect the battery before welding on the axle or frame; keep the ground clamp close to the weld.",
  "Remove paint, undercoating, grease and fuel lines from the heat zone before any heat: coatings give off toxic fumes.",
  "Welding helmet, gloves, flame-resistant clothing and hearing protection; eye protection for cutting and grinding.",
  "Ventilate or extract fumes at the source, especially on coated or galvanised parts.",
  "Fire watch during hot work and for at least 30 minutes after; extinguisher within reach.",
];

export function SafetyCautions() {
  return (
    <section className="rounded-lg border-2 border-graphite-900 bg-white p-4" aria-labelledby="cautions-h">
      <h2 id="cautions-h" className="flex items-center gap-2 font-bold">
        <span aria-hidden="true" className="inline-flex h-6 w-6 items-center justify-center rounded-sm bg-primer-500 text-graphite-950">!</span>
        Before hot work
      </h2>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-graphite-900">
        {HOT_WORK_CAUTIONS.map((c) => <li key={c}>{c}</li>)}
      </ul>
    </section>
  );
}
