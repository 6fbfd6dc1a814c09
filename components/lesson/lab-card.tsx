import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import type { Lab } from "@/lessons";
import type { LessonProgressView } from "@/lib/progress";
import { LessonMarkdown } from "./lesson-markdown";

function labStatus(lab: NonNullable<LessonProgressView["lab"]>): string {
  if (lab.passed) return `Passed — best score ${lab.bestScore} of 100.`;
  if (lab.attempts > 0) return `Not passed yet — ${lab.attempts} graded attempt${lab.attempts === 1 ? "" : "s"}, best score ${lab.bestScore}.`;
  return "Not tried yet.";
}

/** The lab that closes the lesson: its brief, where the learner stands, and the way to the workbench. */
export function LabCard({ lab, progress }: { lab: Lab; progress: NonNullable<LessonProgressView["lab"]> }) {
  return (
    <section id="lab" aria-labelledby="lab-title" className="mt-12 scroll-mt-24 rounded-card border-2 border-accent/30 bg-accent-soft/50 p-5 sm:p-6 print:hidden">
      <p className="text-sm font-semibold uppercase tracking-wide text-accent">Lab</p>
      <h2 id="lab-title" className="mt-1 text-2xl font-semibold tracking-tight text-ink">
        {lab.title}
      </h2>
      <LessonMarkdown markdown={lab.brief} className="mt-3 text-ink" />
      <p className="mt-4 text-sm font-medium text-ink">
        <span className="mr-1.5" aria-hidden="true">
          {progress.passed ? "✓" : "○"}
        </span>
        {labStatus(progress)}
      </p>
      <Link href={`/labs/${lab.slug}`} className={buttonClass("primary", "mt-4")}>
        {progress.attempts > 0 ? "Back to the workbench" : "Open the lab on the workbench"}
        <span aria-hidden="true">→</span>
      </Link>
    </section>
  );
}
