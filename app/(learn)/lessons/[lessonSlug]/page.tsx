import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { LessonFigure } from "@/components/figures/lesson-figure";
import { BenchExerciseBrief } from "@/components/lesson/bench-exercise-brief";
import { CautionCallout } from "@/components/lesson/caution-callout";
import { LabCard } from "@/components/lesson/lab-card";
import { LessonMarkdown } from "@/components/lesson/lesson-markdown";
import { LessonNeighbours } from "@/components/lesson/lesson-neighbours";
import { LessonRail } from "@/components/lesson/lesson-rail";
import { CheckTraces } from "@/components/lesson/check-traces";
import { ChoiceCheckForm } from "@/components/lesson/choice-check-form";
import type { SavedCheck } from "@/components/lesson/check-standing";
import { QuickCheckForm } from "@/components/lesson/quick-check-form";
import { lessonSections } from "@/components/lesson/section-headings";
import { AppFrame } from "@/components/shell/app-frame";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { listQuickCheckStatesByLesson } from "@/db/queries/quick-checks";
import { getCourse, getLesson } from "@/lessons";
import { quickCheckIds } from "@/lessons/schema";
import { describeExpectedEntry } from "@/lib/answers";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { getCourseProgress, recordLessonOpened } from "@/lib/progress";
import { numericCheckFor, presentChoiceCheck, quickCheckSeed, revealedTraces } from "@/lib/quick-checks";
import { answerChoiceCheck, answerQuickCheck } from "./actions";
import { LockedLesson } from "./locked-lesson";

type Props = { params: Promise<{ lessonSlug: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const lesson = getLesson((await params).lessonSlug);
  return { title: lesson ? `Lesson ${lesson.number}: ${lesson.title}` : "Lesson" };
}

export default async function LessonPage({ params }: Props) {
  const { lessonSlug } = await params;
  const user = await requireRouteAccess("/lessons/[lessonSlug]", { lessonSlug });
  const lesson = getLesson(lessonSlug);
  if (!lesson) notFound();

  const progress = await getCourseProgress({ userId: user.id });
  const view = progress.lessons.find((entry) => entry.slug === lesson.slug)!;
  if (view.state === "locked") {
    return (
      <AppFrame user={user}>
        <LockedLesson lesson={view} />
      </AppFrame>
    );
  }

  await recordLessonOpened({ userId: user.id, lessonSlug: lesson.slug });
  const saved = new Map((await listQuickCheckStatesByLesson({ userId: user.id, lessonSlug: lesson.slug })).map((s) => [s.checkId, s]));
  const checkIds = quickCheckIds(lesson.blocks);
  const savedOf = (checkId: string): SavedCheck => {
    const state = saved.get(checkId);
    return { answers: state?.answers ?? 0, lastEntry: state?.lastEntry ?? null, correctEntry: state?.correctEntry ?? null };
  };
  const seedOf = (checkId: string) => quickCheckSeed(user.id, lesson.slug, checkId);
  const sections = lessonSections(lesson.blocks);
  const course = getCourse();
  const index = course.lessons.findIndex((entry) => entry.slug === lesson.slug);

  return (
    <AppFrame user={user}>
      <Breadcrumb trail={[{ href: "/learn", label: "Course map" }]} current={`Lesson ${lesson.number}`} />
      <header className="mb-8 max-w-3xl">
        <p className="text-sm font-semibold uppercase tracking-wide text-copper">
          Lesson {lesson.number} of {course.lessons.length} · about {lesson.minutes} minutes
          {view.state === "done" ? " · done ✓" : ""}
        </p>
        <h1 className="mt-1 text-3xl font-semibold tracking-tight text-ink sm:text-4xl">{lesson.title}</h1>
        <p className="mt-3 text-base text-ink-soft sm:text-lg">{lesson.summary}</p>
      </header>

      <div className="lg:grid lg:grid-cols-[minmax(0,1fr)_16rem] lg:gap-12 print:block">
        <div className="min-w-0">
          <LessonRail sections={sections} progress={view} variant="inline" />
          <article className="max-w-[44rem]">
            {lesson.blocks.map((block, i) => {
              switch (block.kind) {
                case "text":
                  return <LessonMarkdown key={i} markdown={block.markdown} />;
                case "caution":
                  return <CautionCallout key={i} title={block.title} markdown={block.markdown} />;
                case "figure":
                  return <LessonFigure key={i} block={block} />;
                case "check": {
                  const savedCheck = savedOf(block.id);
                  const given = numericCheckFor(block, seedOf(block.id));
                  // Quick checks are answered here on the screen, so a printed lesson leaves them out.
                  return (
                    <div key={block.id} className="print:hidden">
                      <QuickCheckForm
                        action={answerQuickCheck}
                        lessonSlug={lesson.slug}
                        checkId={block.id}
                        number={checkIds.indexOf(block.id) + 1}
                        total={checkIds.length}
                        prompt={<LessonMarkdown markdown={given.prompt} />}
                        hint={<LessonMarkdown markdown={given.hint} />}
                        explanation={savedCheck.correctEntry !== null ? <LessonMarkdown markdown={given.explanation} /> : null}
                        expected={describeExpectedEntry(given.answer.unit)}
                        saved={savedCheck}
                      />
                    </div>
                  );
                }
                case "choice": {
                  const savedCheck = savedOf(block.id);
                  const seed = seedOf(block.id);
                  const shown = presentChoiceCheck(block, seed);
                  const revealed = savedCheck.answers > 0 ? revealedTraces(block, seed) : [];
                  return (
                    <div key={block.id} className="print:hidden">
                      <ChoiceCheckForm
                        action={answerChoiceCheck}
                        lessonSlug={lesson.slug}
                        checkId={block.id}
                        ask={block.ask}
                        number={checkIds.indexOf(block.id) + 1}
                        total={checkIds.length}
                        prompt={<LessonMarkdown markdown={block.prompt} />}
                        run={shown.run}
                        symptom={shown.symptom}
                        figure={
                          shown.traces.length > 0 ? (
                            <CheckTraces traces={shown.traces} caption="Far-end voltage at the first pixel's data pin, drawn by the simulator; time from the first 1 bit leaving the driver." />
                          ) : null
                        }
                        revealed={
                          revealed.length > 0 ? (
                            <CheckTraces traces={revealed} caption="The run you predicted, drawn by the simulator: the far end at the first pixel's data pin." />
                          ) : null
                        }
                        options={shown.options}
                        hint={<LessonMarkdown markdown={block.hint} />}
                        explanation={savedCheck.correctEntry !== null ? <LessonMarkdown markdown={block.explanation} /> : null}
                        saved={savedCheck}
                      />
                    </div>
                  );
                }
              }
            })}
            {lesson.lab && view.lab ? <LabCard lab={lesson.lab} progress={view.lab} /> : null}
            {lesson.bench ? <BenchExerciseBrief exercise={lesson.bench} /> : null}
            <LessonNeighbours previous={course.lessons[index - 1]} next={progress.lessons[index + 1]} />
          </article>
        </div>
        <aside className="hidden lg:block print:hidden" aria-label="In this lesson">
          <div className="sticky top-6 max-h-[calc(100dvh-3rem)] overflow-y-auto pb-6">
            <LessonRail sections={sections} progress={view} variant="side" />
          </div>
        </aside>
      </div>
    </AppFrame>
  );
}
