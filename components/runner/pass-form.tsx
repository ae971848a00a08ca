"use client";
// Recording a weld pass, welder first: the figures typed on the pad with gloves on, the last pass's settings
// one tap away, a stopwatch for arc time, the job's filler lot remembered, ONE governing preheat minimum
// and ONE heat-input figure beside the WPS limit it is checked against (ASME IX QW-409.1 / ISO/TR 17671-1,
// lib/welding); the other figures wait behind a details toggle. Compact on purpose: at 1024 × 768 the
// Record button sits above the step bar without scrolling.
import { useEffect, useState } from "react";
import { governingPreheat } from "@/lib/jobs/preheat";
import type { JobRecord, PassView, QualificationSummary, StepView, WpsSummary } from "@/lib/jobs/record";
import { defaultPadUnit, readPadNumber, show, symbolOf } from "@/lib/jobs/units";
import { checkPassAgainstWps, passHeatInput, type PassHeatInputResult, type WpsCheckResult } from "@/lib/welding";
import { apiJson, ApiError, newKey } from "./api";
import { applyKey, NumberPad, PadField, UnitSwitch } from "./number-pad";
import { storedFrom } from "./pad-state";
import { useSetRecord } from "./use-job";
import { Pill, VerdictBox } from "./verdict";
import { positionChoices, type Weld, wpsRangesOf } from "./weld-parts";

type Field = "volts" | "amps" | "speed" | "bead" | "arcTime" | "energy" | "power" | "preheat" | "interpass";
type Travel = "speed" | "bead";
type Machine = "none" | "energy" | "power";

const SOURCE_WORDS = { procedure: "the procedure", wps: "the WPS", both: "the procedure and the WPS" } as const;

/** A stopwatch for arc time: start when the arc strikes, stop when it breaks; the seconds fill the field. */
function ArcStopwatch({ onStop }: { onStop: (seconds: number) => void }) {
  const [started, setStarted] = useState<number | null>(null);
  const [now, setNow] = useState(0);
  useEffect(() => {
    if (started === null) return;
    const t = window.setInterval(() => setNow(Date.now()), 200);
    return () => window.clearInterval(t);
  }, [started]);
  const elapsed = started === null ? 0 : Math.max(0, (now - started) / 1000);
  return started === null ? (
    <button type="button" className="btn btn-quiet min-h-14 w-full text-lg" onClick={() => { setStarted(Date.now()); setNow(Date.now()); }} data-testid="arc-timer-start">
      <span aria-hidden="true">▶ </span>Start arc timer
    </button>
  ) : (
    <button type="button" className="btn btn-primary min-h-14 w-full text-lg" onClick={() => { onStop(Math.max(1, Math.round((Date.now() - started) / 1000))); setStarted(null); }} data-testid="arc-timer-stop">
      <span aria-hidden="true">■ </span>Stop · <span className="figures">{elapsed.toFixed(0)} s</span>
    </button>
  );
}

export function PassForm({ record, step, wps, qualification }: { record: JobRecord; step: StepView; wps: WpsSummary | undefined; qualification: QualificationSummary | undefined }) {
  const spec = step.spec as Weld;
  const joint = step.joint!;
  const jobId = record.job.id;
  const viewer = record.viewer;
  const setRecord = useSetRecord(jobId);
  const allPasses = record.passes.filter((p) => p.stepId === step.id);
  const nextNumber = allPasses.reduce((n, p) => Math.max(n, p.passNumber), 0) + 1;
  // The job's last pass (any joint): its filler lot is what is on the reel; its settings are one tap away.
  const lastOnJob = [...record.passes].filter((p) => !p.removed).sort((x, y) => x.recordedAt.localeCompare(y.recordedAt)).at(-1);
  const lastHere = [...allPasses].filter((p) => !p.removed).sort((x, y) => x.recordedAt.localeCompare(y.recordedAt)).at(-1) ?? lastOnJob;

  const [speedUnit, setSpeedUnit] = useState<string>(defaultPadUnit("speed", viewer.unitSystem));
  const [lengthUnit, setLengthUnit] = useState<string>(defaultPadUnit("length", viewer.unitSystem));
  const [tempUnit, setTempUnit] = useState<string>(defaultPadUnit("temperature", viewer.unitSystem));
  const [texts, setTexts] = useState<Record<Field, string>>({ volts: "", amps: "", speed: "", bead: "", arcTime: "", energy: "", power: "", preheat: "", interpass: "" });
  const [travel, setTravel] = useState<Travel>("speed");
  const [machine, setMachine] = useState<Machine>("none");
  const [position, setPosition] = useState<string>(spec.position);
  const [filler, setFiller] = useState(lastOnJob?.fillerLot ?? "");
  const [active, setActive] = useState<Field>("volts");
  const [more, setMore] = useState(false);
  const [details, setDetails] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const needBead = travel === "bead" || machine !== "none";
  const needArc = travel === "bead" || machine === "power";
  const volts = storedFrom(texts.volts, { quantity: null, unit: "V" });
  const amps = storedFrom(texts.amps, { quantity: null, unit: "A" });
  const speedMmMin = storedFrom(texts.speed, { quantity: "speed", unit: speedUnit });
  const beadMm = storedFrom(texts.bead, { quantity: "length", unit: lengthUnit });
  const arcTimeS = storedFrom(texts.arcTime, { quantity: null, unit: "s" });
  const energyKJ = storedFrom(texts.energy, { quantity: null, unit: "kJ" });
  const powerW = storedFrom(texts.power, { quantity: null, unit: "W" });
  const preheatC = storedFrom(texts.preheat, { quantity: "temperature", unit: tempUnit });
  const interpassC = storedFrom(texts.interpass, { quantity: "temperature", unit: tempUnit });
  const pos = (n: number | undefined): n is number => n !== undefined && n > 0;

  // The same routes the server takes (db/queries/jobs-steps passFigures): a machine reading wins over V·A/v.
  let a: PassHeatInputResult | null = null;
  let c: PassHeatInputResult | null = null;
  try {
    if (pos(volts) && pos(amps)) {
      if (travel === "speed" && pos(speedMmMin)) a = passHeatInput({ method: "voltage-current", process: spec.process, volts, amps, travelSpeed: { value: speedMmMin, unit: "mm/min" } });
      if (travel === "bead" && pos(beadMm) && pos(arcTimeS)) a = passHeatInput({ method: "voltage-current", process: spec.process, volts, amps, beadLength: { value: beadMm, unit: "mm" }, arcTimeS });
    }
    if (machine === "energy" && pos(energyKJ) && pos(beadMm)) c = passHeatInput({ method: "energy", process: spec.process, energyJ: energyKJ * 1000, beadLength: { value: beadMm, unit: "mm" }, ...(needArc && pos(arcTimeS) ? { arcTimeS } : {}) });
    if (machine === "power" && pos(powerW) && pos(beadMm) && pos(arcTimeS)) c = passHeatInput({ method: "power", process: spec.process, powerW, arcTimeS, beadLength: { value: beadMm, unit: "mm" } });
  } catch {
    a = null;
    c = null;
  }
  const used = machine === "none" ? a : c;
  const travelMmMin = a?.travelSpeedMmPerMin ?? c?.travelSpeedMmPerMin ?? null;
  const basis = wps?.ranges.heatInputBasis ?? "arc-energy";
  const check: WpsCheckResult | null = wps
    ? checkPassAgainstWps(wpsRangesOf(wps), {
        process: spec.process,
        ...(pos(volts) ? { volts } : {}),
        ...(pos(amps) ? { amps } : {}),
        ...(travelMmMin !== null ? { travelSpeedMmPerMin: travelMmMin } : {}),
        ...(used && used.method !== "voltage-current" ? { heatInputKJPerMm: basis === "iso-q" ? (used.heatInputKJPerMm ?? used.arcEnergyKJPerMm) : used.arcEnergyKJPerMm } : {}),
        ...(preheatC !== undefined ? { preheatC } : {}),
        ...(interpassC !== undefined ? { interpassC } : {}),
        position,
      })
    : null;
  const preheat = governingPreheat(spec.minPreheatC, wps?.ranges.preheatMinC);
  const cold = preheatC !== undefined && (preheatC < preheat.minC || !!check?.blocked);
  const flagged = check ? check.findings.filter((f) => !f.ok && f.field !== "preheat" && (f.value !== null || f.shown !== undefined)) : [];
  const refused = qualification !== undefined && !qualification.ok;
  const ready = used !== null && travelMmMin !== null && preheatC !== undefined && !cold && filler.trim().length > 0 && !!wps && !refused;
  const negative = active === "preheat" || active === "interpass";
  const missing = [
    !pos(volts) && "volts",
    !pos(amps) && "amps",
    travel === "speed" && !pos(speedMmMin) && "travel speed",
    needBead && !pos(beadMm) && "bead length",
    needArc && !pos(arcTimeS) && "arc time",
    machine === "energy" && !pos(energyKJ) && "the machine's arc energy",
    machine === "power" && !pos(powerW) && "the machine's average power",
    preheatC === undefined && "measured preheat",
    filler.trim().length === 0 && "filler lot",
  ].filter((m): m is string => typeof m === "string");

  // The one figure the WPS limit is about: arc energy, or Q = k × arc energy when the WPS limits Q.
  const figure = used ? (basis === "iso-q" ? (used.heatInputKJPerMm ?? used.arcEnergyKJPerMm) : used.arcEnergyKJPerMm) : null;
  const figureName = basis === "iso-q" ? "heat input Q" : "arc energy";
  const limit = wps?.ranges.heatInputMaxKJPerMm;

  const setText = (f: Field, t: string) => setTexts((all) => ({ ...all, [f]: t }));
  const sameAsLast = (p: PassView) => {
    const inch = p.travelSpeedUnit === "in/min";
    setTexts((t) => ({
      ...t,
      volts: String(p.volts),
      amps: String(p.amps),
      speed: p.beadLengthMm === null ? (inch ? String(Math.round((p.travelSpeedMmPerMin / 25.4) * 100) / 100) : String(Math.round(p.travelSpeedMmPerMin))) : t.speed,
      bead: p.beadLengthMm !== null ? String(p.beadLengthMm) : t.bead,
    }));
    if (p.beadLengthMm === null) setSpeedUnit(inch ? "in_min" : "mm_min");
    else {
      setTravel("bead");
      setLengthUnit("mm");
    }
    setPosition(p.position);
    setFiller(p.fillerLot);
    setActive("preheat");
  };

  const recordPass = async () => {
    if (!ready || !pos(volts) || !pos(amps) || preheatC === undefined) return;
    setBusy(true);
    setError(null);
    try {
      const typed = (t: string) => readPadNumber(t) ?? 0;
      const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${step.id}/passes`, {
        body: {
          clientKey: newKey(),
          volts,
          amps,
          ...(travel === "speed" ? { travelSpeed: { value: typed(texts.speed), unit: speedUnit === "in_min" ? "in/min" : "mm/min" } } : {}),
          ...(needBead ? { beadLength: { value: typed(texts.bead), unit: lengthUnit === "in" ? "in" : "mm" } } : {}),
          ...(needArc && arcTimeS !== undefined ? { arcTimeS } : {}),
          ...(machine === "energy" && energyKJ !== undefined ? { machineEnergyKJ: energyKJ } : {}),
          ...(machine === "power" && powerW !== undefined ? { machinePowerW: powerW } : {}),
          position,
          preheatC,
          ...(interpassC !== undefined ? { interpassC } : {}),
          fillerLot: filler.trim(),
        },
      });
      setRecord(result.record);
      // The next pass usually runs at the same settings: keep them, clear what is measured per pass.
      setTexts((t) => ({ ...t, arcTime: "", energy: "", power: "", preheat: "", interpass: "" }));
      setActive("interpass");
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The pass was not recorded; try again.");
    } finally {
      setBusy(false);
    }
  };

  const field = (f: Field, label: string, unit: string, invalid?: string | null) => (
    <PadField id={`pass-${f === "arcTime" ? "arc-time" : f}`} label={label} text={texts[f]} unitSymbol={unit} active={active === f} onActivate={() => setActive(f)} onText={(t) => setText(f, t)} invalid={invalid ?? null} />
  );
  const radio = (on: boolean) => `min-h-12 rounded-md border-2 px-3 font-semibold ${on ? "border-graphite-950 bg-graphite-900 text-white" : "border-graphite-400 bg-white text-graphite-950"}`;

  return (
    <section aria-labelledby="newpass-h" className="rounded-lg border-2 border-graphite-700 bg-graphite-50 p-3" data-testid="new-pass">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id="newpass-h" className="text-lg font-bold">Record pass {nextNumber}{joint.round > 1 ? ` (repair round ${joint.round})` : ""}</h3>
        <p className="font-semibold text-graphite-950" data-testid="governing-preheat">
          Preheat at least <span className="figures">{show("temperature", preheat.minC, tempUnit)}</span>{" "}
          <span className="text-sm text-graphite-800">from {SOURCE_WORDS[preheat.source]}{preheat.source !== "both" && preheat.wpsC !== null ? ` (the ${preheat.source === "wps" ? "procedure asks" : "WPS asks"} ${show("temperature", preheat.source === "wps" ? preheat.procedureC : preheat.wpsC, tempUnit)})` : ""}</span>
        </p>
      </div>
      <div className="mt-1 grid gap-3 md:grid-cols-[minmax(0,1fr)_15rem]">
        <div className="min-w-0">
          <div className="grid grid-cols-2 gap-x-3 lg:grid-cols-4">
            {field("volts", "Volts", "V")}
            {field("amps", "Amps", "A")}
            {field("preheat", "Preheat measured", symbolOf("temperature", tempUnit), cold ? `Below ${show("temperature", preheat.minC, tempUnit)}: heat it` : null)}
            {field("interpass", "Interpass", symbolOf("temperature", tempUnit))}
          </div>
          <div className="grid grid-cols-2 gap-x-3 lg:grid-cols-4">
            <div role="radiogroup" aria-label="Travel measured by" className="grid content-start gap-1 pt-5">
              {([["speed", "Travel speed"], ["bead", "Bead + arc time"]] as const).map(([k, label]) => (
                <button key={k} type="button" role="radio" aria-checked={travel === k} onClick={() => { setTravel(k); setActive(k === "speed" ? "speed" : "bead"); }} className={`${radio(travel === k)} min-h-12 px-2 text-sm`} data-testid={`travel-${k}`}>
                  {travel === k ? "● " : "○ "}{label}
                </button>
              ))}
            </div>
            {travel === "speed" ? field("speed", "Travel speed", symbolOf("speed", speedUnit)) : field("bead", "Bead length", symbolOf("length", lengthUnit))}
            {needArc ? (
              <>
                {field("arcTime", "Arc time", "s")}
                <div className="pt-5"><ArcStopwatch onStop={(s) => setText("arcTime", String(s))} /></div>
              </>
            ) : (
              <>
                <div className="sm:col-span-2">
                  <label htmlFor="pass-filler" className="mb-1 block text-sm font-semibold">Filler lot ({spec.filler})</label>
                  <input id="pass-filler" className="field-input min-h-14 text-lg" value={filler} maxLength={60} onChange={(e) => setFiller(e.target.value)} autoComplete="off" />
                </div>
              </>
            )}
          </div>
          {needArc ? (
            <div className="mb-2">
              <label htmlFor="pass-filler" className="mb-1 block text-sm font-semibold">Filler lot ({spec.filler})</label>
              <input id="pass-filler" className="field-input min-h-14 text-lg" value={filler} maxLength={60} onChange={(e) => setFiller(e.target.value)} autoComplete="off" />
            </div>
          ) : null}

          <div className="flex flex-wrap items-center gap-x-3 gap-y-1" data-testid="heat-input">
            {figure !== null ? (
              <p className="text-lg font-bold">
                <span className="figures">{figure.toFixed(2)}</span>{limit !== undefined ? <> of <span className="figures">{limit}</span></> : null} kJ/mm {figureName}
                {limit !== undefined ? <span className="ml-2 align-middle"><Pill tone={figure <= limit ? "pass" : "fail"}>{figure <= limit ? "within" : "over the limit"}</Pill></span> : <span className="text-base font-semibold"> (the WPS sets no limit)</span>}
              </p>
            ) : (
              <p className="text-graphite-800">Heat input shows once {missing.filter((m) => m !== "filler lot" && m !== "measured preheat").join(", ") || "the figures"} {missing.length === 1 ? "is" : "are"} in.</p>
            )}
            {wps && check && !flagged.length ? (
              <span data-testid="wps-check" data-verdict={check.ok ? "pass" : "idle"}>
                <Pill tone={check.ok ? "pass" : "idle"}>{check.ok ? `Within ${wps.reference} revision ${wps.number}` : `Checked against ${wps.reference} revision ${wps.number}`}</Pill>
              </span>
            ) : null}
            <button type="button" className="btn btn-quiet min-h-12 text-sm" aria-expanded={details} onClick={() => setDetails((d) => !d)} data-testid="heat-details-toggle">{details ? "Hide details" : "Details"}</button>
          </div>
          {details ? (
            <div className="mt-1 space-y-2 rounded-lg border-2 border-graphite-300 bg-white p-2 text-sm" data-testid="heat-details">
              {used ? (
                <p>
                  Arc energy <span className="figures">{used.arcEnergyKJPerMm.toFixed(2)}</span> kJ/mm (<span className="figures">{Math.round(used.jPerIn).toLocaleString("en")}</span> J/in)
                  {used.heatInputKJPerMm !== null && used.efficiencyFactor !== null ? <>; heat input Q = k × arc energy with k = {used.efficiencyFactor}: <span className="figures">{used.heatInputKJPerMm.toFixed(2)}</span> kJ/mm</> : null}; {used.clause}.
                  {travelMmMin !== null && travel === "bead" ? <> Travel speed worked out: <span className="figures">{show("speed", travelMmMin, speedUnit)}</span>.</> : null}
                </p>
              ) : null}
              <div className="flex flex-wrap gap-3">
                <UnitSwitch quantity="speed" unit={speedUnit} label="Travel speed" onUnit={setSpeedUnit} />
                <UnitSwitch quantity="length" unit={lengthUnit} label="Bead length" onUnit={setLengthUnit} />
                <UnitSwitch quantity="temperature" unit={tempUnit} label="Temperatures" onUnit={setTempUnit} />
              </div>
            </div>
          ) : null}

          {cold ? (
            <VerdictBox tone="fail" title="Preheat below the minimum: do not weld" testId="preheat-block">
              <p>{show("temperature", preheatC!, tempUnit)} measured; joint {spec.jointId} needs at least {show("temperature", preheat.minC, tempUnit)} (from {SOURCE_WORDS[preheat.source]}). Heat the joint and measure again; a pass this cold is not recorded.</p>
            </VerdictBox>
          ) : null}
          {wps && check && flagged.length ? (
            <VerdictBox tone="wait" title={`Will be flagged: outside ${wps.reference} revision ${wps.number}`} testId="wps-check">
              <ul className="list-disc pl-5">{flagged.map((f) => <li key={f.field}>{f.message}</li>)}</ul>
              <p className="mt-1">It can be recorded, but the round is not signed until a lead accepts the pass as welded or a nonconformance is dispositioned.</p>
            </VerdictBox>
          ) : null}

          <p className="field-error" aria-live="polite" data-testid="pass-error">{error ?? (!ready && !refused && missing.length ? `To record: ${missing.join(", ")}.` : "")}</p>
          <div className="flex gap-3">
            {lastHere ? (
              <button type="button" className="btn btn-quiet min-h-14 shrink-0 px-4 text-lg" onClick={() => sameAsLast(lastHere)} data-testid="same-as-last">Same as last pass</button>
            ) : null}
            <button type="button" className="btn btn-primary min-h-14 flex-1 text-lg" disabled={!ready || busy} onClick={() => void recordPass()} data-testid="record-pass">
              {busy ? "Recording…" : refused ? "Recording refused: qualification lapsed" : `Record pass ${nextNumber}`}
            </button>
            <button type="button" className="btn btn-quiet min-h-14 shrink-0 px-3" aria-expanded={more} onClick={() => setMore((m) => !m)} data-testid="pass-more">{more ? "Less" : "Position, machine…"}</button>
          </div>

          {more ? (
            <div className="mt-3 space-y-3 rounded-lg border-2 border-graphite-300 bg-white p-3" data-testid="pass-more-panel">
              <fieldset>
                <legend className="mb-1 text-sm font-semibold text-graphite-900">Position welded (the procedure says {spec.position})</legend>
                <div role="radiogroup" aria-label="Position welded" className="flex flex-wrap gap-2">
                  {positionChoices(spec, wps).map((p) => (
                    <button key={p} type="button" role="radio" aria-checked={position === p} onClick={() => setPosition(p)} className={`${radio(position === p)} min-w-16`} data-testid={`position-${p}`}>
                      {position === p ? <span aria-hidden="true">● </span> : null}{p}{wps && wps.positions.length && !wps.positions.includes(p) ? " (not in WPS)" : ""}
                    </button>
                  ))}
                </div>
              </fieldset>
              <fieldset>
                <legend className="mb-1 text-sm font-semibold text-graphite-900">Reading from the welding machine (optional; pulsed or waveform-controlled sources)</legend>
                <div role="radiogroup" aria-label="Reading from the welding machine" className="grid grid-cols-3 gap-2">
                  {([["none", "None"], ["energy", "Arc energy kJ"], ["power", "Average power W"]] as const).map(([k, label]) => (
                    <button key={k} type="button" role="radio" aria-checked={machine === k} onClick={() => { setMachine(k); if (k !== "none") setActive(k); }} className={radio(machine === k)} data-testid={`machine-${k}`}>
                      {machine === k ? "● " : "○ "}{label}
                    </button>
                  ))}
                </div>
              </fieldset>
              <div className="grid grid-cols-2 gap-x-3">
                {machine === "energy" ? field("energy", "Arc energy read (machine)", "kJ") : null}
                {machine === "power" ? field("power", "Average power read (machine)", "W") : null}
                {machine !== "none" && travel === "speed" ? field("bead", "Bead length", symbolOf("length", lengthUnit)) : null}
              </div>
            </div>
          ) : null}
        </div>
        <div className="md:sticky md:top-28 md:self-start">
          <NumberPad negative={negative} onKey={(k) => setTexts((all) => ({ ...all, [active]: applyKey(all[active], k, { negative }) }))} />
        </div>
      </div>
    </section>
  );
}
