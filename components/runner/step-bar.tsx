"use client";
// The bar at the foot of the runner: Previous, the step's one main action (sign, raise a nonconformance,
// hand the tablet to an inspector) and Next. Fixed to the screen, so the action is never below the fold.
export function StepBar({ index, total, onPrev, onNext, children }: { index: number; total: number; onPrev: () => void; onNext: () => void; children?: React.ReactNode }) {
  return (
    <nav aria-label="Steps" className="fixed inset-x-0 bottom-0 z-30 border-t-4 border-graphite-950 bg-white" data-testid="step-bar">
      <div className="mx-auto flex max-w-6xl items-center gap-3 px-4 py-2">
        <button type="button" className="btn btn-quiet min-h-14 shrink-0 px-4 text-lg" onClick={onPrev} disabled={index === 0} data-testid="prev-step" aria-label="Previous step">←<span className="hidden sm:inline"> Previous</span></button>
        <div className="flex min-w-0 flex-1 gap-3">{children}</div>
        <span className="figures shrink-0 text-center font-semibold">{index + 1} / {total}</span>
        <button type="button" className="btn btn-quiet min-h-14 shrink-0 px-4 text-lg" onClick={onNext} disabled={index >= total - 1} data-testid="next-step" aria-label="Next step"><span className="hidden sm:inline">Next </span>→</button>
      </div>
    </nav>
  );
}
