export function PageHeader({ title, lead, children }: { title: string; lead?: string; children?: React.ReactNode }) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b-2 border-graphite-200 pb-4">
      <div>
        <h1 className="text-2xl font-bold text-graphite-950">{title}</h1>
        {lead ? <p className="mt-1 max-w-3xl text-graphite-600">{lead}</p> : null}
      </div>
      {children ? <div className="flex flex-wrap gap-2">{children}</div> : null}
    </header>
  );
}
