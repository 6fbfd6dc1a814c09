import Link from "next/link";
import { redirect } from "next/navigation";
import { BrandMark } from "@/components/brand/brand-mark";
import { EdgeSketch } from "@/components/brand/edge-sketch";
import { buttonClass } from "@/components/ui/button-class";
import { getCurrentUser } from "@/lib/auth/current-user";
import { homePathFor } from "@/lib/auth/permissions";

const features = [
  {
    title: "Lessons from first principles",
    body: "Pulse timing, logic thresholds, rise time, cables as transmission lines, reflections and series termination, one step at a time.",
  },
  {
    title: "Labs on a simulated line",
    body: "Choose a cable and a resistor on the workbench; the line simulator draws the far-end waveform and gives a verdict with reasons.",
  },
  {
    title: "Bench photos, reviewed",
    body: "Learners document a real run with a scope photo. Instructors review it against a rubric and give feedback.",
  },
  {
    title: "Certificates that can be checked",
    body: "Graduates get a certificate with a code anyone can verify on a public page.",
  },
] as const;

export default async function LandingPage() {
  const user = await getCurrentUser();
  if (user) redirect(homePathFor(user.role));

  return (
    <div className="flex min-h-dvh flex-col">
      <header className="mx-auto flex w-full max-w-6xl items-center justify-between px-5 py-5">
        <BrandMark />
        <Link href="/sign-in" className={buttonClass("secondary")}>
          Sign in
        </Link>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-5 pb-16">
        <section className="grid items-center gap-10 py-8 md:grid-cols-2 md:py-16">
          <div>
            <p className="text-sm font-semibold uppercase tracking-wide text-copper">For trade schools and their learners</p>
            <h1 className="mt-3 text-4xl font-semibold tracking-tight sm:text-5xl">
              Why does a long pixel run flicker — and how do you fix it?
            </h1>
            <p className="mt-5 text-lg text-ink-soft">
              Edgewise is a course for technicians who install addressable-LED lighting. It teaches the physics of the
              data line from the pulse up to a working design rule, lets every learner practise on the simulator's runs
              before confirming them on the bench, and certifies who has passed.
            </p>
            <div className="mt-8 flex flex-wrap gap-3">
              <Link href="/sign-in" className={buttonClass("primary")}>
                Sign in to your course
              </Link>
            </div>
            <p className="mt-4 text-sm text-ink-faint">Accounts are created by invitation from your school.</p>
          </div>
          <EdgeSketch />
        </section>
        <section aria-labelledby="what-you-get" className="border-t border-line pt-10">
          <h2 id="what-you-get" className="text-2xl font-semibold tracking-tight">
            What a cohort gets
          </h2>
          <ul className="mt-6 grid gap-5 sm:grid-cols-2 lg:grid-cols-4">
            {features.map((feature) => (
              <li key={feature.title} className="rounded-card border border-line bg-surface p-5">
                <h3 className="font-semibold">{feature.title}</h3>
                <p className="mt-2 text-sm text-ink-soft">{feature.body}</p>
              </li>
            ))}
          </ul>
        </section>
      </main>
      <footer className="border-t border-line">
        <p className="mx-auto max-w-6xl px-5 py-5 text-sm text-ink-faint">
          The simulator is a teaching model: confirm every real run on the bench. Power and mains work follow local
          electrical codes and belong to licensed people.
        </p>
      </footer>
    </div>
  );
}
