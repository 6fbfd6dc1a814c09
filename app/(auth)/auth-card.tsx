export function AuthCard({ title, lead, children }: { title: string; lead?: React.ReactNode; children: React.ReactNode }) {
  return (
    <section className="rounded-card border border-line bg-surface p-6 shadow-sm sm:p-8">
      <h1 className="text-2xl font-semibold tracking-tight">{title}</h1>
      {lead ? <div className="mt-2 text-ink-soft">{lead}</div> : null}
      <div className="mt-6">{children}</div>
    </section>
  );
}
