/**
 * The load benchmark's learners, made in the private instance's database through the app's own
 * functions: accounts in the demo school, enrolled in its first cohort, lessons 1–7 done so that
 * every lab is open, and a session each from the app's session store (no sign-in in the measured
 * window: argon2 there would measure the password hash, not the workbench).
 * Needs process.env to hold the instance's environment before it is imported.
 */
import { and, eq, inArray, like } from "drizzle-orm";
import { db } from "@/db/client";
import { demoCohorts, demoSchool } from "@/db/demo-data";
import { markLessonsCompleted } from "@/db/queries/progress";
import { cohortMemberships, cohorts, labAttempts, schools, users } from "@/db/schema";
import { getCourse, type Lab } from "@/lessons";
import { formatInUnit } from "@/lib/answers";
import { hashPassword } from "@/lib/auth/password";
import { createSession } from "@/lib/auth/session-store";
import type { BenchLearner } from "./protocol";

const EMAIL_DOMAIN = "load-bench.example";

async function demoCohortOfSchool(): Promise<{ cohortId: string; schoolId: string }> {
  const [row] = await db
    .select({ cohortId: cohorts.id, schoolId: schools.id })
    .from(cohorts)
    .innerJoin(schools, eq(schools.id, cohorts.schoolId))
    .where(and(eq(schools.slug, demoSchool.slug), eq(cohorts.name, demoCohorts[0].name)));
  if (!row) throw new Error("The instance has no demo cohort: its seed did not run.");
  return row;
}

/** Learner `i` works on lab `i mod 8`, so every lab is graded, cheap and costly alike. */
export async function createBenchLearners(count: number): Promise<BenchLearner[]> {
  const { cohortId, schoolId } = await demoCohortOfSchool();
  const course = getCourse();
  const labs = course.lessons.flatMap((lesson) => (lesson.lab ? [lesson.lab] : []));
  const lessonsBeforeLast = course.lessons.slice(0, -1);
  // One hash for all: they share a password nobody types, and 200 argon2 runs would only slow set-up.
  const passwordHash = await hashPassword(`load bench ${Date.now()}`);
  const numbered = Array.from({ length: count }, (_, i) => String(i + 1).padStart(3, "0"));
  const created = await db
    .insert(users)
    .values(numbered.map((n) => ({ schoolId, email: `learner-${n}@${EMAIL_DOMAIN}`, name: `Load learner ${n}`, role: "learner" as const, passwordHash })))
    .returning({ id: users.id, email: users.email });
  created.sort((a, b) => a.email.localeCompare(b.email));
  await db.insert(cohortMemberships).values(created.map((user) => ({ cohortId, userId: user.id, role: "learner" as const })));

  const completedAt = new Date();
  const completions = lessonsBeforeLast.map((lesson) => ({ lessonSlug: lesson.slug, completedAt }));
  return Promise.all(
    created.map(async (user, i): Promise<BenchLearner> => {
      await markLessonsCompleted({ userId: user.id, completions });
      const cookie = await createSession(user.id);
      // Each learner in a /64 of its own in the IPv6 documentation range (RFC 3849): a header value only.
      const address = `2001:db8:${(i + 1).toString(16)}::1`;
      return { userId: user.id, cookie: `${cookie.name}=${cookie.value}`, address, ...labWork(labs[i % labs.length]) };
    }),
  );
}

/** The lab's own reference solution and its first catalogued mistake (valid for every learner's variant), and right answers. */
function labWork(lab: Lab): Omit<BenchLearner, "cookie" | "userId" | "address"> {
  const answers = Object.fromEntries(lab.questions.map((q) => [q.id, formatInUnit(q.answer.value, q.answer.unit)]));
  return { labSlug: lab.slug, passing: lab.reference.solution, failing: lab.reference.mistakes[0].choices, answers };
}

/** Lets the instance's database stop without this process's idle connections erroring. */
export async function closeBenchDatabase(): Promise<void> {
  await db.$client.end();
}

/** Attempts stored for the bench learners, all labs together. */
export async function countBenchAttempts(): Promise<number> {
  const learners = db.select({ id: users.id }).from(users).where(like(users.email, `%@${EMAIL_DOMAIN}`));
  return db.$count(labAttempts, inArray(labAttempts.userId, learners));
}
