import { pathToFileURL } from "node:url";
import { computeSteeringGeometry, type SteeringInput } from "@/lib/geometry";

/** Lifted-truck-like layout (invented): 1,000 heave points, 50 axle-end holes on a 10 mm pitch. */
function sweepInput(): SteeringInput {
  return {
    trackBar: { frameEnd: { y: -420, z: 180 }, axleEnd: { y: 480, z: 60 } },
    dragLink: { pitmanEnd: { y: -400, z: 150 }, knuckleEnd: { y: 440, z: 95 } },
    axleCenter: { y: 0, z: 0 },
    steeringArmLength: 160,
    steeringRatio: 16,
    // −100 … +99.8 mm by 0.2 mm = 1,000 points.
    travel: { bump: 99.8, droop: 100, step: 0.2 },
    holeRange: { zMin: -150, zMax: 340, pitch: 10 },
  };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? (s[m] ?? 0) : ((s[m - 1] ?? 0) + (s[m] ?? 0)) / 2;
}

function time(fn: () => void, runs: number): number {
  for (let i = 0; i < 5; i++) fn(); // warm the JIT before measuring
  const ms: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    ms.push(performance.now() - t0);
  }
  return median(ms);
}

export async function benchGeometry(): Promise<{ name: string; ms: number; detail: string }[]> {
  const input = sweepInput();
  const probe = computeSteeringGeometry(input);
  const points = probe.heave.length;
  const holes = probe.holes?.length ?? 0;
  const runs = 21;
  const ms = time(() => computeSteeringGeometry(input), runs);
  return [
    {
      name: "geometry: steering sweep with hole ranking",
      ms,
      detail: `${points} heave points × ${holes} candidate holes, median of ${runs} runs (target < 20 ms)`,
    },
  ];
}

/**
 * The best heights (axle end and frame end) on their own: the same layout without candidate holes, so the
 * figure is the two optimum searches plus one heave sweep; then with a roll sweep of 5° either way by 0.1°.
 */
export async function benchOptimum(): Promise<{ name: string; ms: number; detail: string }[]> {
  const { holeRange: _holes, ...base } = sweepInput();
  void _holes;
  const withRoll: SteeringInput = { ...base, roll: { maxDeg: 5, stepDeg: 0.1 } };
  const runs = 11;
  const heaveOnly = computeSteeringGeometry(base);
  const rolled = computeSteeringGeometry(withRoll);
  return [
    {
      name: "geometry: best heights (axle end and frame end), heave",
      ms: time(() => computeSteeringGeometry(base), runs),
      detail: `${heaveOnly.heave.length} heave points, optimum z ${heaveOnly.optimum.z.toFixed(2)} mm, median of ${runs} runs`,
    },
    {
      name: "geometry: best heights (axle end and frame end), heave and roll",
      ms: time(() => computeSteeringGeometry(withRoll), runs),
      detail: `${rolled.heave.length} heave + ${rolled.roll.length} roll points (combined grid included), optimum z ${rolled.optimum.z.toFixed(2)} mm, median of ${runs} runs`,
    },
  ];
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const r of [...(await benchGeometry()), ...(await benchOptimum())]) console.log(`${r.name}: ${r.ms.toFixed(3)} ms (${r.detail})`);
}
