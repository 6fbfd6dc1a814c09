import type { Course } from "@/lessons";

export type GradebookItemKind = "lab" | "bench";

/** One column of the grade book: a graded lab or a bench exercise, in the order of the course. */
export type GradebookItem = {
  key: string;
  kind: GradebookItemKind;
  slug: string;
  title: string;
  /** Short column label, numbered by the lesson it closes ("Lab 3", "Bench 7"). */
  label: string;
  lessonNumber: number;
};

export function itemKey(kind: GradebookItemKind, slug: string): string {
  return `${kind}:${slug}`;
}

/** The course's labs and bench exercises, lesson by lesson, each lesson's lab before its bench exercise. */
export function gradebookItems(course: Course): GradebookItem[] {
  return course.lessons.flatMap((lesson) => {
    const items: GradebookItem[] = [];
    if (lesson.lab) {
      items.push({
        key: itemKey("lab", lesson.lab.slug),
        kind: "lab",
        slug: lesson.lab.slug,
        title: lesson.lab.title,
        label: `Lab ${lesson.number}`,
        lessonNumber: lesson.number,
      });
    }
    if (lesson.bench) {
      items.push({
        key: itemKey("bench", lesson.bench.slug),
        kind: "bench",
        slug: lesson.bench.slug,
        title: lesson.bench.title,
        label: `Bench ${lesson.number}`,
        lessonNumber: lesson.number,
      });
    }
    return items;
  });
}
