// One computed figure: what it is, the number in tabular digits, its unit and where the formula comes from.
export function Figure({
  label,
  value,
  unit,
  source,
  testId,
  size = "md",
}: {
  label: React.ReactNode;
  value: string;
  unit?: string;
  source?: React.ReactNode;
  testId?: string;
  size?: "md" | "lg";
}) {
  return (
    <div className="rounded-md border-2 border-graphite-200 bg-white p-3">
      <dt className="text-sm font-semibold text-graphite-700">{label}</dt>
      <dd className="mt-1">
        <span data-testid={testId} className={`figures font-semibold text-graphite-950 ${size === "lg" ? "text-3xl" : "text-xl"}`}>{value}</span>
        {unit ? <span className="ml-1 font-semibold text-graphite-700">{unit}</span> : null}
      </dd>
      {source ? <dd className="mt-1 text-xs text-graphite-600">{source}</dd> : null}
    </div>
  );
}
