import { BrandMark } from "@/components/brand/brand-mark";

/** Full-page message used by the 403, 404 and error screens. */
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
    <main className="mx-auto flex min-h-dvh w-full max-w-xl flex-col justify-center px-5 py-12">
      <div className="mb-10">
        <BrandMark />
      </div>
      <p className="font-mono text-sm font-semibold text-copper">{code}</p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight sm:text-4xl">{title}</h1>
      <div className="mt-4 space-y-3 text-base text-ink-soft">{children}</div>
      <div className="mt-8 flex flex-wrap gap-3">{actions}</div>
    </main>
  );
}
