import { PROCESS_INFO } from "@/lib/welding/processes";
import type { UnitSystem } from "@/lib/units";
import { BASIS_LABELS, CURRENT_LABELS, POLARITY_LABELS, type WpsContent } from "@/lib/welding/wps-schema";
import { measure, measureSpan, span } from "./format";

function Row({ label, children, testId }: { label: string; children: React.ReactNode; testId?: string }) {
  return (
    <div className="grid gap-1 border-t border-graphite-100 py-2 sm:grid-cols-[11rem_1fr]">
      <dt className="font-semibold text-graphite-700">{label}</dt>
      <dd data-testid={testId}>{children}</dd>
    </div>
  );
}

// The read view of one revision: what a welder works to and an inspector checks against.
export function RevisionView({ content: c, system }: { content: WpsContent; system: UnitSystem }) {
  const current = c.currentType ? `${CURRENT_LABELS[c.currentType]}${c.polarity ? `, ${POLARITY_LABELS[c.polarity].replace("Electrode", "electrode")}` : ""}` : "—";
  return (
    <div className="grid gap-4 2xl:grid-cols-2">
      <section className="card p-4" aria-labelledby="wps-what">
        <h2 id="wps-what" className="font-bold">Process and materials</h2>
        <dl className="mt-2">
          <Row label="Process" testId="wps-process">
            {c.process ? (
              <>
                {c.process} <span className="figures">· ISO 4063 {c.iso4063 ?? "—"}</span>
                <span className="block text-sm text-graphite-600">{PROCESS_INFO[c.process].name}</span>
              </>
            ) : (
              "—"
            )}
          </Row>
          <Row label="Base metals">{c.baseMetals || "—"}</Row>
          <Row label="Thickness"><span className="figures">{measureSpan("length", c.thicknessMinMm, c.thicknessMaxMm, system)}</span></Row>
          <Row label="Filler metal">
            {c.fillerClassification || "—"}
            {c.fillerDiameterMm !== null ? <span className="figures"> · ⌀ {measure("length", c.fillerDiameterMm, system)}</span> : null}
          </Row>
          <Row label="Shielding gas">
            {c.shieldingGas || "None (flux shielded)"}
            {c.gasFlowLPerMin !== null ? <span className="figures"> · {c.gasFlowLPerMin} L/min</span> : null}
          </Row>
          <Row label="Current and polarity">{current}</Row>
          <Row label="Positions" testId="wps-positions">
            {c.positions.length ? (
              <span className="flex flex-wrap gap-1">
                {c.positions.map((p) => <span key={p} className="figures rounded border border-graphite-400 px-2 py-0.5 text-sm">{p}</span>)}
              </span>
            ) : (
              "—"
            )}
          </Row>
        </dl>
      </section>
      <section className="card p-4" aria-labelledby="wps-ranges">
        <h2 id="wps-ranges" className="font-bold">Ranges a pass must stay inside</h2>
        <dl className="mt-2">
          <Row label="Voltage"><span className="figures" data-testid="wps-volts">{span(c.voltsMin, c.voltsMax, "V")}</span></Row>
          <Row label="Current"><span className="figures" data-testid="wps-amps">{span(c.ampsMin, c.ampsMax, "A")}</span></Row>
          <Row label="Travel speed"><span className="figures">{measureSpan("speed", c.travelSpeedMinMmPerMin, c.travelSpeedMaxMmPerMin, system)}</span></Row>
          <Row label="Heat input, maximum">
            {c.heatInputMaxKJPerMm !== null ? (
              <>
                <span className="figures">{c.heatInputMaxKJPerMm} kJ/mm</span>
                {c.heatInputBasis ? <span className="block text-sm text-graphite-600">{BASIS_LABELS[c.heatInputBasis]}</span> : null}
              </>
            ) : (
              "No limit set"
            )}
          </Row>
          <Row label="Preheat, minimum"><span className="figures" data-testid="wps-preheat">{measure("temperature", c.preheatMinC, system)}</span></Row>
          <Row label="Interpass, maximum"><span className="figures">{c.interpassMaxC !== null ? measure("temperature", c.interpassMaxC, system) : "No limit set"}</span></Row>
        </dl>
        <p className="mt-2 text-sm text-graphite-600">A pass below the minimum preheat is refused; any other value outside these ranges needs a nonconformance.</p>
      </section>
      {c.notes ? (
        <section className="card p-4 2xl:col-span-2" aria-labelledby="wps-notes">
          <h2 id="wps-notes" className="font-bold">Notes and technique</h2>
          <p className="mt-2 whitespace-pre-line">{c.notes}</p>
        </section>
      ) : null}
    </div>
  );
}
