export function PageHeading({ title, lead, eyebrow }: { title: string; lead?: React.ReactNode; eyebrow?: string }) {
  return (
    <header className="mb-8">
      {eyebrow ? <p className="mb-1 text-sm font-semibold uppercase tracking-wide text-copper">{eyebrow}</p> : null}
      <h1 className="text-3xl font-semibold tracking-tight text-ink sm:text-4xl">{title}</h1>
      {lead ? <p className="mt-3 max-w-2xl text-base text-ink-soft sm:text-lg">{lead}</p> : null}
    </header>
  );
}
