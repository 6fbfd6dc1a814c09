import { z } from "zod";
import { getCourse } from "@/lessons";

// What the cohort form may send. The course list has one entry today; the field exists so a
// second course needs no new form.

export const cohortInputSchema = z
  .object({
    name: z
      .string({ error: "Give the cohort a name." })
      .trim()
      .min(1, "Give the cohort a name.")
      .max(120, "Use at most 120 characters."),
    courseSlug: z.string({ error: "Choose a course." }).refine((slug) => slug === getCourse().slug, "Choose a course from the list."),
    startsOn: z.iso.date({ error: "Enter the first day as a date." }),
    endsOn: z.iso.date({ error: "Enter the last day as a date." }),
    instructorIds: z.array(z.uuid({ error: "Choose instructors from the list." })).max(50, "Choose at most 50 instructors."),
  })
  .refine((cohort) => cohort.endsOn >= cohort.startsOn, {
    path: ["endsOn"],
    message: "The last day cannot be before the first day.",
  });

export function courseOptions(): { value: string; label: string }[] {
  const course = getCourse();
  return [{ value: course.slug, label: course.title }];
}
