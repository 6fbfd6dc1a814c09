import { randomUUID } from "node:crypto";
import { and, eq, inArray, like, or } from "drizzle-orm";
import { genUploader } from "uploadthing/client";
import { afterAll, beforeAll } from "vitest";
import { db } from "@/db/client";
import { demoCohorts, demoSchool } from "@/db/demo-data";
import { markLessonsCompleted } from "@/db/queries/progress";
import {
  benchPhotos,
  benchReviews,
  benchSubmissions,
  certificates,
  cohortMemberships,
  cohorts,
  invitations,
  passwordResets,
  schools,
  users,
  type Role,
} from "@/db/schema";
import { getCourse, getLessonOfLab } from "@/lessons";
import { hashPassword } from "@/lib/auth/password";
import { createSession } from "@/lib/auth/session-store";
import { generateToken, hashToken } from "@/lib/auth/tokens";
import { generateCertificateCode } from "@/lib/certificates/code";
import type { UploadRouter } from "@/lib/uploads/upload-router";
import { openBenchExercises } from "../../integration/support/bench-people";
import { noisyPhoto } from "../../support/uploads/noisy-photo";
import { installXhrOverFetch } from "../../support/uploads/xhr-over-fetch";
import { baseUrl } from "./browser";

// The people and records the authorization tests act on. Fernhallow's two seeded cohorts are
// cohort A and B; a second, invented school ("Quarrydown Signal Institute") gets an admin, a
// cohort, an instructor and a learner. Everyone here is created for the run, with addresses no
// other test uses (all at access.example), and removed again afterwards, so the seeded school
// looks the same to the tests that run after these.

export const personas = ["anonymous", "learnerA", "learnerB", "instructorA", "instructorB", "admin", "otherAdmin"] as const;
export type Persona = (typeof personas)[number];
export type Member = Exclude<Persona, "anonymous">;

/**
 * Learner A has done the lessons before it, so it is open to them; learner B is at the graded lab's
 * lesson, before it, so it is locked to them (bench exercises follow their lesson's lock).
 */
export const benchExercise = "build-a-run";
/** The exercise whose handed-in work (with one real photo) sits in instructor A's queue. */
export const reviewedExercise = "document-a-run";
/** A lab behind five lessons, with a choice known to pass it (E24 150 Ω). */
export const gradedLab = { slug: "lone-lead-termination", choices: { main: { seriesResistance: 240 } } } as const;

/** Every person made here signs in with this. */
export const personPassword = "access matrix password";
let passwordHash: Promise<string> | undefined;

export type Person = { id: string; email: string; name: string; schoolId: string; cookie: string };

export type AccessWorld = {
  people: Record<Member, Person>;
  /** Fernhallow's signatory as the run found it, put back afterwards (the admin's accepted calls change it). */
  homeSignatory: { id: string; signatoryName: string | null; signatoryRole: string | null };
  otherSchoolId: string;
  cohortA: string;
  /** A cohort of Fernhallow made for the run, for edits that must not touch the seeded ones. */
  spareCohort: string;
  lessonSlug: string;
  checkId: string;
  /** A quick check of the same lesson answered by choosing. */
  choiceCheckId: string;
  attemptId: string;
  reviewSubmissionId: string;
  /** Learner A's editable bench work, photos may still be added to it. */
  draftSubmissionId: string;
  /** Learner B's draft of the same exercise, left from before its lesson was locked to them (made in the database). */
  lockedDraftSubmissionId: string;
  photoId: string;
  certificateId: string;
  certificateCode: string;
  invitationToken: string;
  resetToken: string;
  /** A learner of cohort A made on demand, for actions that use somebody up (deactivate, review, revoke). */
  createLearner: () => Promise<Person>;
  createInvitation: () => Promise<string>;
  createResetToken: () => Promise<string>;
  createCertificate: (learner?: Person) => Promise<{ id: string; code: string }>;
  /** The learner's submission of `exerciseSlug`, put back to an editable draft with `photos` photo rows. */
  prepareDraft: (learner: Person, exerciseSlug: string, photos?: number) => Promise<{ submissionId: string; photoIds: string[] }>;
  submitWork: (learner: Person) => Promise<string>;
  cookieFor: (userId: string) => Promise<string>;
};

async function cookieFor(userId: string): Promise<string> {
  const cookie = await createSession(userId);
  return `${cookie.name}=${cookie.value}`;
}

const accessDomain = "access.example";
const accessAddresses = `%@${accessDomain}`;

/** A new address at the one domain every account and invitation of these tests uses, so all can be found and removed. */
export function accessAddress(label: string): string {
  return `${label}.${randomUUID().slice(0, 8)}@${accessDomain}`;
}

async function createUser(params: { schoolId: string; role: Role; label: string; cohortId?: string }): Promise<Person> {
  const [user] = await db
    .insert(users)
    .values({
      schoolId: params.schoolId,
      email: accessAddress(params.label),
      name: `Access ${params.label}`,
      role: params.role,
      passwordHash: await (passwordHash ??= hashPassword(personPassword)),
    })
    .returning();
  if (params.cohortId && params.role !== "admin") {
    await db.insert(cohortMemberships).values({ cohortId: params.cohortId, userId: user!.id, role: params.role });
  }
  return { id: user!.id, email: user!.email, name: user!.name, schoolId: user!.schoolId, cookie: await cookieFor(user!.id) };
}

async function findCohortId(name: string): Promise<string> {
  const [cohort] = await db.select({ id: cohorts.id }).from(cohorts).where(eq(cohorts.name, name));
  if (!cohort) throw new Error(`The seeded cohort "${name}" is missing.`);
  return cohort.id;
}

async function createCohort(schoolId: string, name: string): Promise<string> {
  const [cohort] = await db
    .insert(cohorts)
    .values({ schoolId, name, courseSlug: getCourse().slug, startsOn: "2026-09-07", endsOn: "2027-03-26" })
    .returning({ id: cohorts.id });
  return cohort!.id;
}

/** Lessons before the graded lab's, done, so the lab is open. */
async function openGradedLab(userId: string): Promise<void> {
  const number = getLessonOfLab(gradedLab.slug)!.number;
  const earlier = getCourse().lessons.filter((lesson) => lesson.number < number);
  await markLessonsCompleted({ userId, completions: earlier.map((lesson) => ({ lessonSlug: lesson.slug, completedAt: new Date() })) });
}

async function submitAttempt(learner: Person): Promise<string> {
  const response = await fetch(`${baseUrl}/api/labs/${gradedLab.slug}/attempts`, {
    method: "POST",
    headers: { "content-type": "application/json", cookie: learner.cookie },
    body: JSON.stringify({ choices: gradedLab.choices, idempotencyKey: randomUUID() }),
  });
  if (response.status !== 201) throw new Error(`The lab attempt was not stored: ${response.status} ${await response.text()}`);
  return ((await response.json()) as { attempt: { id: string } }).attempt.id;
}

/** One real photo, sent through the app's upload route and the local upload service. */
async function uploadPhoto(learner: Person, submissionId: string): Promise<string> {
  const restoreXhr = installXhrOverFetch();
  try {
    const { uploadFiles } = genUploader<UploadRouter>({ url: `${baseUrl}/api/uploadthing`, package: "edgewise-tests", fetch: globalThis.fetch });
    const file = new File([new Uint8Array(noisyPhoto(64, 48))], "scope.png", { type: "image/png" });
    const [uploaded] = await uploadFiles("benchPhoto", { files: [file], input: { submissionId }, headers: { cookie: learner.cookie } });
    const outcome = uploaded!.serverData as { photoId?: string; rejected?: string };
    if (!outcome.photoId) throw new Error(`The photo was refused: ${outcome.rejected}`);
    return outcome.photoId;
  } finally {
    restoreXhr();
  }
}

async function buildAccessWorld(): Promise<AccessWorld> {
  const [home] = await db
    .select({ id: schools.id, signatoryName: schools.signatoryName, signatoryRole: schools.signatoryRole })
    .from(schools)
    .where(eq(schools.slug, demoSchool.slug));
  if (!home) throw new Error("The demo school is missing: the seed must run before the browser tests.");
  const schoolId = home.id;
  const suffix = randomUUID().slice(0, 8);
  const [other] = await db
    .insert(schools)
    .values({ slug: `quarrydown-${suffix}`, name: `Quarrydown Signal Institute ${suffix}` })
    .returning({ id: schools.id });
  const otherSchoolId = other!.id;
  const [cohortA, cohortB, otherCohort, spareCohort] = await Promise.all([
    findCohortId(demoCohorts[0].name),
    findCohortId(demoCohorts[1].name),
    createCohort(otherSchoolId, "Signal runs — spring"),
    createCohort(schoolId, `Access spare cohort ${suffix}`),
  ]);

  const people: Record<Member, Person> = {
    learnerA: await createUser({ schoolId, role: "learner", label: "learner-a", cohortId: cohortA }),
    learnerB: await createUser({ schoolId, role: "learner", label: "learner-b", cohortId: cohortB }),
    instructorA: await createUser({ schoolId, role: "instructor", label: "instructor-a", cohortId: cohortA }),
    instructorB: await createUser({ schoolId, role: "instructor", label: "instructor-b", cohortId: cohortB }),
    admin: await createUser({ schoolId, role: "admin", label: "admin" }),
    otherAdmin: await createUser({ schoolId: otherSchoolId, role: "admin", label: "other-admin" }),
  };
  await createUser({ schoolId: otherSchoolId, role: "instructor", label: "other-instructor", cohortId: otherCohort });
  await createUser({ schoolId: otherSchoolId, role: "learner", label: "other-learner", cohortId: otherCohort });

  const createLearner = () => createUser({ schoolId, role: "learner", label: "spare-learner", cohortId: cohortA });

  const createInvitation = async () => {
    const token = generateToken();
    await db.insert(invitations).values({
      schoolId,
      email: accessAddress("invited"),
      role: "learner",
      cohortId: cohortA,
      tokenHash: hashToken(token),
      expiresAt: new Date(Date.now() + 86_400_000),
    });
    return token;
  };

  const createResetToken = async () => {
    const owner = await createLearner();
    const token = generateToken();
    await db.insert(passwordResets).values({ userId: owner.id, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + 3_600_000) });
    return token;
  };

  const createCertificate = async (learner?: Person) => {
    const owner = learner ?? (await createLearner());
    const [row] = await db
      .insert(certificates)
      .values({
        code: generateCertificateCode(),
        userId: owner.id,
        courseSlug: getCourse().slug,
        schoolId,
        cohortId: cohortA,
        learnerName: owner.name,
        courseTitle: getCourse().title,
        schoolName: demoSchool.name,
        cohortName: demoCohorts[0].name,
        scoreSummary: { labs: [], averageScore: 80, benchExercises: [] },
      })
      .returning({ id: certificates.id, code: certificates.code });
    return row!;
  };

  const prepareDraft = async (learner: Person, exerciseSlug: string, photos = 0) => {
    const cohortId = (await db.select({ cohortId: cohortMemberships.cohortId }).from(cohortMemberships).where(eq(cohortMemberships.userId, learner.id)))[0]!
      .cohortId;
    const [submission] = await db
      .insert(benchSubmissions)
      .values({ learnerId: learner.id, cohortId, exerciseSlug })
      .onConflictDoUpdate({ target: [benchSubmissions.learnerId, benchSubmissions.exerciseSlug], set: { status: "draft", submittedAt: null } })
      .returning({ id: benchSubmissions.id });
    const submissionId = submission!.id;
    const photoIds: string[] = [];
    for (let i = 0; i < photos; i++) {
      const [photo] = await db
        .insert(benchPhotos)
        .values({ submissionId, fileKey: `access-${randomUUID()}`, name: "scope.png", size: 1000, contentType: "image/png", width: 64, height: 48 })
        .returning({ id: benchPhotos.id });
      photoIds.push(photo!.id);
    }
    return { submissionId, photoIds };
  };

  /** Work handed in on the reviewed exercise, waiting for a review in the learner's cohort. */
  const submitWork = async (learner: Person) => {
    const { submissionId } = await prepareDraft(learner, reviewedExercise);
    await db
      .update(benchSubmissions)
      .set({ status: "submitted", submittedAt: new Date() })
      .where(and(eq(benchSubmissions.id, submissionId), eq(benchSubmissions.learnerId, learner.id)));
    return submissionId;
  };

  await openBenchExercises(people.learnerA.id);
  await openGradedLab(people.learnerB.id);
  const lesson = getCourse().lessons[0]!;
  const check = lesson.blocks.find((block) => block.kind === "check");
  if (!check || check.kind !== "check") throw new Error(`Lesson ${lesson.slug} has no quick check.`);
  const choiceCheck = lesson.blocks.find((block) => block.kind === "choice");
  if (!choiceCheck || choiceCheck.kind !== "choice") throw new Error(`Lesson ${lesson.slug} has no choice check.`);

  const { submissionId: reviewSubmissionId } = await prepareDraft(people.learnerA, reviewedExercise);
  const photoId = await uploadPhoto(people.learnerA, reviewSubmissionId);
  await submitWork(people.learnerA);
  const certificate = await createCertificate(people.learnerA);

  return {
    people,
    homeSignatory: home,
    otherSchoolId,
    cohortA,
    spareCohort,
    lessonSlug: lesson.slug,
    checkId: check.id,
    choiceCheckId: choiceCheck.id,
    attemptId: await submitAttempt(people.learnerA),
    reviewSubmissionId,
    draftSubmissionId: (await prepareDraft(people.learnerA, benchExercise)).submissionId,
    lockedDraftSubmissionId: (await prepareDraft(people.learnerB, benchExercise)).submissionId,
    photoId,
    certificateId: certificate.id,
    certificateCode: certificate.code,
    invitationToken: await createInvitation(),
    resetToken: await createResetToken(),
    createLearner,
    createInvitation,
    createResetToken,
    createCertificate,
    prepareDraft,
    submitWork,
    cookieFor,
  };
}

export function cookieOf(world: AccessWorld, persona: Persona): string {
  return persona === "anonymous" ? "" : world.people[persona].cookie;
}

/**
 * Deletes everything the world made and every account and invitation the accepted actions made
 * (all at access.example): certificates and reviews first, as they keep their people.
 */
async function removeAccessWorld(world: AccessWorld): Promise<void> {
  const made = db.select({ id: users.id }).from(users).where(like(users.email, accessAddresses));
  await db.delete(certificates).where(or(inArray(certificates.userId, made), eq(certificates.schoolId, world.otherSchoolId)));
  await db.delete(benchReviews).where(inArray(benchReviews.reviewerId, made));
  await db.delete(invitations).where(like(invitations.email, accessAddresses));
  await db.delete(users).where(like(users.email, accessAddresses));
  await db.delete(cohorts).where(eq(cohorts.id, world.spareCohort));
  await db.delete(schools).where(eq(schools.id, world.otherSchoolId));
  const { id, ...signatory } = world.homeSignatory;
  await db.update(schools).set(signatory).where(eq(schools.id, id));
}

/** The world for one test file: built before its tests, handed to `use`, removed after them. */
export function setUpAccessWorld(use: (world: AccessWorld) => void): void {
  let built: AccessWorld | undefined;
  beforeAll(async () => {
    built = await buildAccessWorld();
    use(built);
  });
  afterAll(async () => {
    if (built) await removeAccessWorld(built);
  });
}
