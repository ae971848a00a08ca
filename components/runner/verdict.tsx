// Verdicts in word and shape, dark enough for 7:1 contrast under shop lights.
export type VerdictTone = "pass" | "fail" | "wait" | "idle" | "info";

const STYLE: Record<VerdictTone, { box: string; shape: string }> = {
  pass: { box: "border-[#2f4a08] bg-[#eef5d6] text-[#1f3305]", shape: "●" },
  fail: { box: "border-[#8a1d15] bg-[#fbe9e7] text-[#8a1d15]", shape: "✕" },
  wait: { box: "border-[#5c3d00] bg-[#fdf1d6] text-[#5c3d00]", shape: "▲" },
  idle: { box: "border-graphite-500 bg-white text-graphite-900", shape: "○" },
  info: { box: "border-graphite-900 bg-graphite-50 text-graphite-950", shape: "◆" },
};

export function VerdictBox({ tone, title, children, testId }: { tone: VerdictTone; title: string; children?: React.ReactNode; testId?: string }) {
  const s = STYLE[tone];
  return (
    <div className={`rounded-lg border-4 px-4 py-3 ${s.box}`} data-testid={testId} data-verdict={tone} role="status" aria-live="polite">
      <p className="flex items-center gap-2 text-xl font-bold">
        <span aria-hidden="true" className="text-2xl">{s.shape}</span>
        {title}
      </p>
      {children ? <div className="mt-1 text-base font-semibold">{children}</div> : null}
    </div>
  );
}

export function Pill({ tone, children, testId }: { tone: VerdictTone; children: React.ReactNode; testId?: string }) {
  const s = STYLE[tone];
  return (
    <span data-testid={testId} className={`inline-flex items-center gap-1 rounded-md border-2 px-2 py-0.5 text-sm font-bold ${s.box}`}>
      <span aria-hidden="true">{s.shape}</span>
      {children}
    </span>
  );
}
