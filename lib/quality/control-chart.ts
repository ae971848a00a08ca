// Individuals chart (I-MR, also called XmR): for one measurement at a time, such as the heat input of each
// weld pass in the order it was welded. Method as in the NIST/SEMATECH e-Handbook of Statistical Methods,
// "Individuals Control Charts" (section 6.3.2.2, number from memory), and ASTM E2587 (from memory):
//   centre line  CL  = x̄, the mean of the values
//   moving range MRᵢ = |xᵢ − xᵢ₋₁| (i = 2…n), MR̄ their mean
//   limits       UCL = x̄ + 2.66·MR̄, LCL = x̄ − 2.66·MR̄
// 2.66 is 3/d₂ with d₂ = 1.128 for moving ranges of two (σ̂ = MR̄/d₂; 3σ limits).

export const IMR_FACTOR = 2.66;
export const IMR_METHOD = "Individuals chart (I-MR): centre line = mean; control limits = mean ± 2.66 × average moving range";
// Shown on screen: no clause number, since it is from memory.
export const IMR_SOURCE = "NIST/SEMATECH e-Handbook of Statistical Methods, individuals control charts";

type IndividualsChart = {
  n: number;
  mean: number;
  /** average moving range of consecutive values; null with fewer than two values */
  mrBar: number | null;
  ucl: number | null;
  lcl: number | null;
};

/** Limits of an individuals chart; the values in time order. */
export function individualsChart(values: readonly number[]): IndividualsChart | null {
  const xs = values.filter((v) => Number.isFinite(v));
  if (xs.length === 0) return null;
  const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
  if (xs.length < 2) return { n: xs.length, mean, mrBar: null, ucl: null, lcl: null };
  let sum = 0;
  for (let i = 1; i < xs.length; i++) sum += Math.abs(xs[i]! - xs[i - 1]!);
  const mrBar = sum / (xs.length - 1);
  return { n: xs.length, mean, mrBar, ucl: mean + IMR_FACTOR * mrBar, lcl: mean - IMR_FACTOR * mrBar };
}

/** Outside the control limits: a signal to look for a cause (not by itself a reject). */
export function outOfControl(chart: IndividualsChart | null, x: number): boolean {
  if (!chart || chart.ucl === null || chart.lcl === null) return false;
  return x > chart.ucl || x < chart.lcl;
}
