import { pathToFileURL } from "node:url";
import { renderTraveller, type RenderOptions } from "@/lib/pdf/traveller";
import { buildTravellerFixture } from "@/tests/fixtures/pdf/traveller-fixture";

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? (s[m] ?? 0) : ((s[m - 1] ?? 0) + (s[m] ?? 0)) / 2;
}

function pageCount(pdf: Buffer): number {
  return pdf.toString("latin1").match(/\/Type \/Page\b/g)?.length ?? 0;
}

/** Renders the invented 40-step job with 12 photo thumbnails (320 × 240 JPEG): one warm-up, then the median. */
export async function benchTraveller(): Promise<{ name: string; ms: number; detail: string; targetMs?: number }[]> {
  const data = await buildTravellerFixture({ released: true, steps: 40, photos: 12 });
  const runs = 5;
  const out: { name: string; ms: number; detail: string; targetMs?: number }[] = [];
  const cases: { name: string; options: RenderOptions }[] = [
    { name: "traveller: 40-step job, 12 photos, PDF/A-2b", options: {} },
    { name: "traveller: 40-step job, 12 photos, plain PDF", options: { conformance: null } },
  ];
  for (const c of cases) {
    const warm = await renderTraveller(data, c.options); // fonts, JIT and image decoders warm up here
    const wall: number[] = [];
    const cpu: number[] = [];
    for (let i = 0; i < runs; i++) {
      const t0 = performance.now();
      const u0 = process.cpuUsage();
      await renderTraveller(data, c.options);
      const u = process.cpuUsage(u0);
      wall.push(performance.now() - t0);
      cpu.push((u.user + u.system) / 1000);
    }
    out.push({
      name: c.name,
      ms: median(wall),
      detail: `${pageCount(warm)} pages, ${Math.round(warm.length / 1024)} KiB, median of ${runs} runs after a warm-up; CPU ${median(cpu).toFixed(0)} ms`,
      targetMs: 2000,
    });
  }
  return out;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const r of await benchTraveller()) console.log(`${r.name}: ${r.ms.toFixed(0)} ms (${r.detail})`);
}
