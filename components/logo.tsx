// The Gusset mark: a triangular gusset plate with a weld bead along its hypotenuse.
export function Logo({ className = "h-8 w-8" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <path d="M4 28 V4 L28 28 Z" fill="#aec22b" stroke="#0e1110" strokeWidth="2" strokeLinejoin="round" />
      <path d="M6.5 8.5 l3 3 m1.5 1.5 l3 3 m1.5 1.5 l3 3 m1.5 1.5 l3 3" stroke="#0e1110" strokeWidth="2.2" strokeLinecap="round" />
      <circle cx="10" cy="22" r="2.2" fill="#0e1110" />
    </svg>
  );
}

export function Wordmark() {
  return (
    <span className="inline-flex items-center gap-2">
      <Logo />
      <span className="text-xl font-bold tracking-tight">Gusset</span>
    </span>
  );
}
