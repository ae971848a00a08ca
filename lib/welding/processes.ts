// Arc welding processes with their ISO 4063 reference numbers and the thermal efficiency factor k of
// ISO/TR 17671-1 (EN 1011-1). k values: pub; ISO 4063 numbers: from memory (REFERENCES.md "Heat input").

export const PROCESSES = ["SMAW", "GMAW", "FCAW", "GTAW", "SAW", "PAW"] as const;
export type WeldingProcess = (typeof PROCESSES)[number];

export interface ProcessInfo {
  process: WeldingProcess;
  name: string;
  /** ISO 4063 numbers covered by this process family. */
  iso4063: readonly number[];
  /** Thermal efficiency k, ISO/TR 17671-1. */
  efficiencyFactor: number;
}

export const PROCESS_INFO: Readonly<Record<WeldingProcess, ProcessInfo>> = {
  SMAW: { process: "SMAW", name: "Shielded metal arc (manual metal arc)", iso4063: [111], efficiencyFactor: 0.8 },
  // 131 MIG (inert gas), 135 MAG (active gas).
  GMAW: { process: "GMAW", name: "Gas metal arc (MIG/MAG)", iso4063: [131, 135], efficiencyFactor: 0.8 },
  // 114 self-shielded flux-cored, 136 flux-cored MAG, 138 metal-cored MAG.
  FCAW: { process: "FCAW", name: "Flux-cored arc", iso4063: [114, 136, 138], efficiencyFactor: 0.8 },
  GTAW: { process: "GTAW", name: "Gas tungsten arc (TIG)", iso4063: [141], efficiencyFactor: 0.6 },
  SAW: { process: "SAW", name: "Submerged arc (single wire)", iso4063: [121], efficiencyFactor: 1.0 },
  PAW: { process: "PAW", name: "Plasma arc", iso4063: [15], efficiencyFactor: 0.6 },
};

export function efficiencyFactor(process: WeldingProcess): number {
  return PROCESS_INFO[process].efficiencyFactor;
}

/** Looks a process family up by an ISO 4063 number (e.g. 135 → GMAW); undefined if not covered. */
export function processFromIso4063(n: number): WeldingProcess | undefined {
  return PROCESSES.find((p) => PROCESS_INFO[p].iso4063.includes(n));
}
