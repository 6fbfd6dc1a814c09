import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { findLabDraft } from "@/db/queries/lab-drafts";
import { LessonMarkdown } from "@/components/lesson/lesson-markdown";
import { AppFrame } from "@/components/shell/app-frame";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { Workbench } from "@/components/workbench/workbench";
import { getLab, getLessonOfLab, labVariant } from "@/lessons";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { variantSeedFor } from "@/lib/grading";
import { openingDraft } from "@/lib/lab-drafts";
import { findLessonProgressView } from "@/lib/progress";
import { workbenchSetup } from "./workbench-setup";
import { LockedLab } from "./locked-lab";

type Props = { params: Promise<{ labSlug: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const lab = getLab((await params).labSlug);
  return { title: lab ? `Lab: ${lab.title}` : "Lab" };
}

export default async function LabPage({ params }: Props) {
  const { labSlug } = await params;
  const user = await requireRouteAccess("/labs/[labSlug]", { labSlug });
  const lab = getLab(labSlug);
  const lesson = getLessonOfLab(labSlug);
  if (!lab || !lesson) notFound();

  const progress = await findLessonProgressView({ userId: user.id, lessonSlug: lesson.slug });
  if (progress?.state === "locked") {
    return (
      <AppFrame user={user}>
        <LockedLab lesson={progress} labTitle={lab.title} />
      </AppFrame>
    );
  }

  const variant = labVariant(lab, variantSeedFor(user.id, lab.slug));
  const setup = workbenchSetup(lab, variant);
  const saved = await findLabDraft({ userId: user.id, labSlug: lab.slug });
  const draft = openingDraft(lab, variant, saved);
  const questionTexts = Object.fromEntries(
    lab.questions.map((q) => [
      q.id,
      {
        prompt: <LessonMarkdown markdown={q.prompt} className="text-ink [&_p]:my-0" />,
        hint: <LessonMarkdown markdown={`Hint: ${q.hint}`} className="text-xs text-ink-faint [&_p]:my-0 [&_p]:leading-5" />,
      },
    ]),
  );

  return (
    <AppFrame user={user}>
      <Breadcrumb
        trail={[
          { href: "/learn", label: "Course map" },
          { href: `/lessons/${lesson.slug}`, label: `Lesson ${lesson.number}: ${lesson.title}` },
        ]}
        current="Lab"
      />
      <header className="mb-6">
        <p className="mb-1 text-sm font-semibold uppercase tracking-wide text-copper">Lab {lesson.number} · on the workbench</p>
        <h1 className="text-3xl font-semibold tracking-tight text-ink sm:text-4xl">{lab.title}</h1>
      </header>
      <section aria-label="The brief" className="mb-8 max-w-3xl rounded-card border border-line bg-surface p-5 sm:p-6">
        <LessonMarkdown markdown={lab.brief} />
        <p className="mt-4 text-sm text-ink-soft">
          Your scenario is your own: lengths, cables and drivers differ from learner to learner within the lab&apos;s ranges. Need the theory again?{" "}
          <Link href={`/lessons/${lesson.slug}`} className="font-medium text-accent underline underline-offset-2">
            Back to lesson {lesson.number}
          </Link>
          .
        </p>
      </section>
      <Workbench
        setup={setup}
        questionTexts={questionTexts}
        draft={draft}
        savedAt={saved?.updatedAt.getTime() ?? null}
        draftStorageKey={`edgewise:workbench:${user.id}:${lab.slug}`}
      />
    </AppFrame>
  );
}
