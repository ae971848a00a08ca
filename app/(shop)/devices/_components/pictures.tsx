// Line drawings for the setup steps: the device, and on its screen the one thing that step is about.
const stroke = { fill: "none", stroke: "currentColor", strokeWidth: 3, strokeLinecap: "round", strokeLinejoin: "round" } as const;

function Seal({ x, y }: { x: number; y: number }) {
  return (
    <g transform={`translate(${x} ${y})`}>
      <circle r="13" {...stroke} />
      <path d="M -6 0 L -1 5 L 7 -5" {...stroke} />
      <path d="M -8 10 L -10 22 L 0 17 L 10 22 L 8 10" {...stroke} />
    </g>
  );
}

export function TabletPicture({ label }: { label: string }) {
  return (
    <svg viewBox="0 0 120 90" role="img" aria-label={label} className="h-20 w-28 text-graphite-800">
      <rect x="6" y="6" width="108" height="78" rx="9" {...stroke} />
      <rect x="16" y="14" width="88" height="62" rx="2" className="fill-primer-100" stroke="none" />
      <Seal x={60} y={38} />
    </svg>
  );
}

export function PhoneSettingsPicture({ label }: { label: string }) {
  return (
    <svg viewBox="0 0 120 90" role="img" aria-label={label} className="h-20 w-28 text-graphite-800">
      <rect x="22" y="4" width="76" height="82" rx="10" {...stroke} />
      <rect x="30" y="12" width="60" height="66" rx="2" className="fill-primer-100" stroke="none" />
      <circle cx="60" cy="36" r="11" {...stroke} />
      <path d="M 60 19 V 23 M 60 49 V 53 M 43 36 H 47 M 73 36 H 77" {...stroke} />
      <path d="M 40 64 H 66 M 72 64 h 8" {...stroke} />
    </svg>
  );
}

export function DesktopPicture({ label }: { label: string }) {
  return (
    <svg viewBox="0 0 120 90" role="img" aria-label={label} className="h-20 w-28 text-graphite-800">
      <rect x="8" y="6" width="104" height="64" rx="4" {...stroke} />
      <rect x="16" y="13" width="88" height="50" rx="1" className="fill-primer-100" stroke="none" />
      <path d="M 46 84 H 74 M 60 70 V 84" {...stroke} />
      <rect x="50" y="34" width="20" height="16" rx="2" {...stroke} />
      <path d="M 54 34 V 28 a 6 6 0 0 1 12 0 V 34" {...stroke} />
    </svg>
  );
}
