// State is shown by word and shape, never by colour alone.
const SHAPES = { pass: "●", fail: "✕", warn: "▲", info: "◆", idle: "○" } as const;
const TONES = {
  pass: "border-verdict-pass bg-verdict-passbg text-verdict-pass",
  fail: "border-verdict-fail bg-verdict-failbg text-verdict-fail",
  warn: "border-verdict-warn bg-verdict-warnbg text-verdict-warn",
  info: "border-graphite-600 bg-graphite-100 text-graphite-900",
  idle: "border-graphite-400 bg-white text-graphite-700",
} as const;

export type Tone = keyof typeof SHAPES;

export function StatusBadge({ tone, children, testId }: { tone: Tone; children: React.ReactNode; testId?: string }) {
  return (
    <span data-testid={testId} className={`inline-flex items-center gap-1 rounded border px-2 py-0.5 text-sm font-semibold ${TONES[tone]}`}>
      <span aria-hidden="true">{SHAPES[tone]}</span>
      {children}
    </span>
  );
}
