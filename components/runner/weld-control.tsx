"use client";
// A weld step: the joint as the procedure specifies it, the hot-work cautions, and weld passes recorded one
// by one with heat input computed as the numbers are typed (ASME IX QW-409.1 / ISO/TR 17671-1, lib/welding).
import { useState } from "react";
import { HOT_WORK_CAUTIONS } from "@/components/safety-cautions";
import type { PassView } from "@/lib/jobs/record";
import { defaultPadUnit, readPadNumber, show, symbolOf } from "@/lib/jobs/units";
import type { Step } from "@/lib/procedures/schema";
import { heatInput } from "@/lib/welding";
import { apiJson, ApiError, newKey } from "./api";
import { applyKey, NumberPad, PadField, UnitSwitch } from "./number-pad";
import { storedFrom } from "./pad-state";
import { useSetRecord } from "./use-job";
import { Pill, VerdictBox } from "./verdict";
import type { JobRecord } from "@/lib/jobs/record";

type Weld = Extract<Step, { kind: "weld" }>;
type Field = "volts" | "amps" | "speed" | "preheat" | "interpass";

// Heat-tint words for the gauge: always a word beside the colour.
function tint(kJmm: number) {
  if (kJmm < 1) return { word: "Low", colour: "bg-tint-straw" };
  if (kJmm < 2) return { word: "Moderate", colour: "bg-tint-bronze" };
  if (kJmm < 3) return { word: "High", colour: "bg-tint-purple" };
  return { word: "Very high", colour: "bg-tint-blue" };
}

export function HotWorkNote() {
  return (
    <section className="rounded-lg border-4 border-graphite-950 bg-primer-100 p-4" aria-labelledby="hotwork-h" data-testid="hot-work-cautions">
      <h3 id="hotwork-h" className="flex items-center gap-2 text-lg font-bold text-graphite-950">
        <span aria-hidden="true" className="inline-flex h-8 w-8 items-center justify-center rounded bg-graphite-950 text-primer-300">!</span>
        Hot work
      </h3>
      <ul className="mt-2 list-disc space-y-1 pl-6 text-graphite-950">
        {HOT_WORK_CAUTIONS.map((c) => <li key={c}>{c}</li>)}
      </ul>
    </section>
  );
}

export function WeldControl({ jobId, stepId, spec, passes, readOnly, canRecord, me, unitSystem }: { jobId: string; stepId: string; spec: Weld; passes: PassView[]; readOnly: boolean; canRecord: boolean; me: string; unitSystem: "metric" | "imperial" }) {
  const setRecord = useSetRecord(jobId);
  const [speedUnit, setSpeedUnit] = useState<string>(defaultPadUnit("speed", unitSystem));
  const [tempUnit, setTempUnit] = useState<string>(defaultPadUnit("temperature", unitSystem));
  const [texts, setTexts] = useState<Record<Field, string>>({ volts: "", amps: "", speed: "", preheat: "", interpass: "" });
  const [filler, setFiller] = useState("");
  const [active, setActive] = useState<Field>("volts");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [striking, setStriking] = useState<string | null>(null);

  const volts = storedFrom(texts.volts, { quantity: null, unit: "V" });
  const amps = storedFrom(texts.amps, { quantity: null, unit: "A" });
  const speedMmMin = storedFrom(texts.speed, { quantity: "speed", unit: speedUnit });
  const preheatC = storedFrom(texts.preheat, { quantity: "temperature", unit: tempUnit });
  const interpassC = storedFrom(texts.interpass, { quantity: "temperature", unit: tempUnit });
  const hi = volts && amps && speedMmMin && volts > 0 && amps > 0 && speedMmMin > 0 ? heatInput({ process: spec.process, volts, amps, travelSpeed: { value: speedMmMin, unit: "mm/min" } }) : null;
  const cold = preheatC !== undefined && preheatC < spec.minPreheatC;
  const ready = hi !== null && preheatC !== undefined && !cold && filler.trim().length > 0;
  const negative = active === "preheat" || active === "interpass";

  const record = async () => {
    if (!ready || !volts || !amps || !speedMmMin || preheatC === undefined) return;
    setBusy(true);
    setError(null);
    try {
      const typedSpeed = readPadNumber(texts.speed) ?? 0;
      const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${stepId}/passes`, {
        body: {
          clientKey: newKey(),
          volts,
          amps,
          travelSpeed: { value: typedSpeed, unit: speedUnit === "in_min" ? "in/min" : "mm/min" },
          preheatC,
          ...(interpassC !== undefined ? { interpassC } : {}),
          fillerLot: filler.trim(),
        },
      });
      setRecord(result.record);
      setTexts((t) => ({ ...t, preheat: "", interpass: "" }));
      setActive("preheat");
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The pass was not recorded; try again.");
    } finally {
      setBusy(false);
    }
  };

  const strike = async (passId: string) => {
    setError(null);
    try {
      setRecord(await apiJson<JobRecord>(`/api/jobs/${jobId}/steps/${stepId}/passes/${passId}`, { method: "DELETE" }));
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The pass was not struck out.");
    } finally {
      setStriking(null);
    }
  };

  const live = passes.filter((p) => !p.removed);
  return (
    <div className="space-y-4">
      <dl className="grid grid-cols-2 gap-2 rounded-lg border-2 border-graphite-700 bg-white p-3 sm:grid-cols-4" data-testid="joint-spec">
        {[
          ["Joint", `${spec.jointId} · ${spec.jointType}`],
          ["Size × length", `${show("length", spec.sizeMm, defaultPadUnit("length", unitSystem))} × ${show("length", spec.lengthMm, defaultPadUnit("length", unitSystem))}`],
          ["Position · process", `${spec.position} · ${spec.process}`],
          ["WPS · filler", `${spec.wpsRef} · ${spec.filler}`],
          ["Minimum preheat", show("temperature", spec.minPreheatC, tempUnit)],
        ].map(([k, v]) => (
          <div key={k}>
            <dt className="text-sm font-semibold text-graphite-800">{k}</dt>
            <dd className="figures font-semibold text-graphite-950">{v}</dd>
          </div>
        ))}
      </dl>
      <HotWorkNote />
      <section aria-labelledby="passes-h">
        <h3 id="passes-h" className="text-lg font-bold">Passes recorded: <span className="figures" data-testid="pass-count">{live.length}</span></h3>
        {passes.length ? (
          <div className="overflow-x-auto">
            <table className="mt-2 w-full text-left" data-testid="pass-table">
              <thead className="bg-graphite-100 text-sm">
                <tr><th className="px-2 py-1">#</th><th className="px-2 py-1">Welder</th><th className="px-2 py-1">V · A</th><th className="px-2 py-1">Travel</th><th className="px-2 py-1">Preheat · interpass</th><th className="px-2 py-1">Filler lot</th><th className="px-2 py-1">Heat input</th><th className="px-2 py-1"><span className="sr-only">Actions</span></th></tr>
              </thead>
              <tbody>
                {passes.map((p) => (
                  <tr key={p.id} className={`border-t border-graphite-200 ${p.removed ? "text-graphite-700 line-through" : ""}`}>
                    <td className="figures px-2 py-2">{p.passNumber}</td>
                    <td className="px-2 py-2">{p.welder.name}</td>
                    <td className="figures px-2 py-2">{p.volts} · {p.amps}</td>
                    <td className="figures px-2 py-2">{show("speed", p.travelSpeedMmPerMin, p.travelSpeedUnit === "in/min" ? "in_min" : "mm_min")}</td>
                    <td className="figures px-2 py-2">{show("temperature", p.preheatC, tempUnit)}{p.interpassC !== null ? ` · ${show("temperature", p.interpassC, tempUnit)}` : ""}</td>
                    <td className="px-2 py-2">{p.fillerLot}</td>
                    <td className="figures px-2 py-2">{p.heatInputKJPerMm.toFixed(2)} kJ/mm</td>
                    <td className="px-2 py-2">
                      {p.removed ? <span className="no-underline">Struck out</span> : !readOnly && p.welder.id === me ? (
                        striking === p.id ? (
                          <span className="flex gap-2">
                            <button type="button" className="btn btn-danger min-h-12" onClick={() => void strike(p.id)}>Confirm</button>
                            <button type="button" className="btn btn-quiet min-h-12" onClick={() => setStriking(null)}>Keep</button>
                          </span>
                        ) : (
                          <button type="button" className="btn btn-quiet min-h-12" onClick={() => setStriking(p.id)}>Strike out</button>
                        )
                      ) : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : <p className="mt-1 text-graphite-800">No passes yet.</p>}
      </section>
      {!readOnly && canRecord ? (
        <section aria-labelledby="newpass-h" className="rounded-lg border-2 border-graphite-700 bg-graphite-50 p-3">
          <h3 id="newpass-h" className="text-lg font-bold">Record pass {live.length + 1}</h3>
          <div className="mt-2 grid gap-4 md:grid-cols-[minmax(0,1fr)_18rem]">
            <div className="grid gap-x-3 sm:grid-cols-2">
              <PadField id="pass-volts" label="Volts" text={texts.volts} unitSymbol="V" active={active === "volts"} onActivate={() => setActive("volts")} onText={(t) => setTexts({ ...texts, volts: t })} />
              <PadField id="pass-amps" label="Amps" text={texts.amps} unitSymbol="A" active={active === "amps"} onActivate={() => setActive("amps")} onText={(t) => setTexts({ ...texts, amps: t })} />
              <div>
                <PadField id="pass-speed" label="Travel speed" text={texts.speed} unitSymbol={symbolOf("speed", speedUnit)} active={active === "speed"} onActivate={() => setActive("speed")} onText={(t) => setTexts({ ...texts, speed: t })} />
                <UnitSwitch quantity="speed" unit={speedUnit} label="Travel speed" onUnit={setSpeedUnit} />
              </div>
              <div>
                <PadField id="pass-preheat" label="Preheat measured" text={texts.preheat} unitSymbol={symbolOf("temperature", tempUnit)} active={active === "preheat"} onActivate={() => setActive("preheat")} onText={(t) => setTexts({ ...texts, preheat: t })} invalid={cold ? `Below the ${show("temperature", spec.minPreheatC, tempUnit)} minimum` : null} />
                <UnitSwitch quantity="temperature" unit={tempUnit} label="Temperatures" onUnit={setTempUnit} />
              </div>
              <PadField id="pass-interpass" label="Interpass (optional)" text={texts.interpass} unitSymbol={symbolOf("temperature", tempUnit)} active={active === "interpass"} onActivate={() => setActive("interpass")} onText={(t) => setTexts({ ...texts, interpass: t })} />
              <div>
                <label htmlFor="pass-filler" className="mb-1 block text-sm font-semibold">Filler lot / heat no.</label>
                <input id="pass-filler" className="field-input min-h-14 text-lg" value={filler} maxLength={60} onChange={(e) => setFiller(e.target.value)} autoComplete="off" />
              </div>
              <div className="sm:col-span-2 mt-3 space-y-3">
                {hi ? (
                  <div data-testid="heat-input">
                    <p className="text-lg font-bold">
                      Heat input <span className="figures">{hi.heatInputKJPerMm.toFixed(2)} kJ/mm</span>{" "}
                      <span className="text-base font-semibold">(arc energy {hi.arcEnergyKJPerMm.toFixed(2)} kJ/mm, <span className="figures">{Math.round(hi.jPerIn).toLocaleString("en")}</span> J/in, k = {hi.efficiencyFactor})</span>
                    </p>
                    <div className="mt-1 flex items-center gap-3">
                      <div className="h-4 flex-1 overflow-hidden rounded border-2 border-graphite-700 bg-white" aria-hidden="true">
                        <div className={`h-full ${tint(hi.heatInputKJPerMm).colour}`} style={{ width: `${Math.min(100, (hi.heatInputKJPerMm / 4) * 100)}%` }} />
                      </div>
                      <Pill tone="info">{tint(hi.heatInputKJPerMm).word}</Pill>
                    </div>
                  </div>
                ) : <p className="text-graphite-800">Heat input shows once volts, amps and travel speed are in.</p>}
                {cold ? (
                  <VerdictBox tone="fail" title="Preheat below the minimum" testId="preheat-block">
                    {show("temperature", preheatC!, tempUnit)} measured; joint {spec.jointId} needs at least {show("temperature", spec.minPreheatC, tempUnit)}. Heat the joint and measure again before welding.
                  </VerdictBox>
                ) : null}
                <p className="field-error min-h-6" aria-live="polite" data-testid="pass-error">{error ?? ""}</p>
                <button type="button" className="btn btn-primary min-h-14 w-full text-lg" disabled={!ready || busy} onClick={() => void record()} data-testid="record-pass">
                  {busy ? "Recording…" : `Record pass ${live.length + 1}`}
                </button>
              </div>
            </div>
            <div className="md:sticky md:top-28 md:self-start">
              <NumberPad negative={negative} onKey={(k) => setTexts({ ...texts, [active]: applyKey(texts[active], k, { negative }) })} />
            </div>
          </div>
        </section>
      ) : null}
    </div>
  );
}
