const PROCEDURE_NOTE =
  "Procedures support, and never replace, the vehicle maker's specifications, local codes and qualified or licensed practice.";

export function ProcedureNote({ className = "" }: { className?: string }) {
  return (
    <p className={`rounded-md border-2 border-graphite-700 bg-graphite-50 px-3 py-2 text-sm text-graphite-900 ${className}`} role="note" data-testid="procedure-note">
      <span aria-hidden="true" className="mr-1 font-bold">△</span>
      <strong>Check before you rely on it.</strong> {PROCEDURE_NOTE}
    </p>
  );
}
