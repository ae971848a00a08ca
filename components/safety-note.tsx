import { SAFETY_NOTE } from "@/lib/safety";

export function SafetyNote({ className = "" }: { className?: string }) {
  return (
    <p className={`rounded-md border-2 border-graphite-700 bg-graphite-50 px-3 py-2 text-sm text-graphite-900 ${className}`} role="note">
      <span aria-hidden="true" className="mr-1 font-bold">△</span>
      <strong>Check before you rely on it.</strong> {SAFETY_NOTE}
    </p>
  );
}
