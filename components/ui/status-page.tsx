/** The body of the 403 and 404 screens: a code, a plain title, what to do next. */
export function StatusPage({
  code,
  title,
  children,
  actions,
}: {
  code: string;
  title: string;
  children: React.ReactNode;
  actions: React.ReactNode;
}) {
  return (
    <section className="mx-auto max-w-xl py-6 sm:py-16">
      <p className="font-mono text-sm font-semibold text-copper">{code}</p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight sm:text-4xl">{title}</h1>
      <div className="mt-4 space-y-3 text-base text-ink-soft">{children}</div>
      <div className="mt-8 flex flex-wrap gap-3">{actions}</div>
    </section>
  );
}
