// One minimum preheat for a weld joint: the procedure step and its WPS may both set one, and the stricter
// (the higher temperature) governs. Pure: the runner shows it, the tests check it.

export type PreheatSource = "procedure" | "wps" | "both";

export type GoverningPreheat = { minC: number; source: PreheatSource; procedureC: number; wpsC: number | null };

export function governingPreheat(procedureMinC: number, wpsMinC: number | undefined | null): GoverningPreheat {
  const wpsC = wpsMinC ?? null;
  if (wpsC === null || wpsC < procedureMinC) return { minC: procedureMinC, source: "procedure", procedureC: procedureMinC, wpsC };
  if (wpsC > procedureMinC) return { minC: wpsC, source: "wps", procedureC: procedureMinC, wpsC };
  return { minC: procedureMinC, source: "both", procedureC: procedureMinC, wpsC };
}
