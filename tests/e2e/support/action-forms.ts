import { getCourse } from "@/lessons";
import { findBenchExercise } from "@/lib/bench/exercises";
import { statedRun } from "../../support/bench-run";
import { accessAddress, benchExercise, personPassword, reviewedExercise, type AccessWorld, type Member, type Persona } from "./access-world";

// How every server action is called with input it accepts: the page its form lives on, the
// arguments bound in front of (previous state, form data), and the form fields. Fresh records are
// made for each call where an accepted call uses one up. The authorization matrix calls these as
// every persona; the hostile-input test corrupts the fields as a persona allowed to send them.

export type FieldValue = string | File;

export type ActionCallPlan = { path: string; args: unknown[]; cookie?: string };

export type ActionForm = {
  /** The persona whose call is accepted: the one the hostile-input test sends as. */
  allowed: Member;
  path: (world: AccessWorld) => string;
  /** Arguments bound in front of (previous state, form data), or every argument of an action that takes no form. */
  bound?: (world: AccessWorld, persona: Persona) => Promise<unknown[]> | unknown[];
  /** The form an allowed persona sends; absent for actions that take no form data. */
  fields?: (world: AccessWorld, persona: Persona) => Promise<Record<string, FieldValue>> | Record<string, FieldValue>;
  /**
   * Fields that, made wrong in any way, must make the action refuse and write nothing. Other
   * fields may hold values the action rightly accepts (any text is a feedback, a quick-check
   * entry is stored right or wrong), so the hostile-input test always spoils one of these.
   */
  guarded?: readonly string[];
  /** Positions of bound arguments that, made wrong, must make the action refuse. */
  guardedArgs?: readonly number[];
  /** A separate session for the call, for actions that end the one they are sent with. */
  session?: (world: AccessWorld, persona: Persona) => Promise<string>;
  /** Tables the action writes even when it refuses, by design (sign-in throttling). */
  bookkeeping?: readonly string[];
};

export const idleState = { status: "idle" } as const;
const actionPassword = "a fresh matrix password 2026";

function rubricScores(): Record<string, string> {
  const { rubric } = findBenchExercise(reviewedExercise)!.exercise;
  return Object.fromEntries(rubric.map((criterion) => [`score-${criterion.id}`, String(criterion.points)]));
}

/** A second session of the persona, for actions that end the session they are sent with (signing in or out). */
function throwawaySession(world: AccessWorld, persona: Persona): Promise<string> {
  return persona === "anonymous" ? Promise.resolve("") : world.cookieFor(world.people[persona].id);
}

/** Puts the persona's own bench work back to a draft holding one photo, when the persona has bench work. */
async function draftWithPhoto(world: AccessWorld, persona: Persona): Promise<string[]> {
  const learner = persona === "learnerA" || persona === "learnerB" ? world.people[persona] : world.people.learnerA;
  return (await world.prepareDraft(learner, benchExercise, 1)).photoIds;
}

export const actionForms: Record<string, ActionForm> = {
  "app/(learn)/lessons/[lessonSlug]/actions.ts#answerQuickCheck": {
    allowed: "learnerA",
    path: (world) => `/lessons/${world.lessonSlug}`,
    fields: (world) => ({ lessonSlug: world.lessonSlug, checkId: world.checkId, entry: "2 ms" }),
    guarded: ["lessonSlug", "checkId"],
  },
  "app/(learn)/lessons/[lessonSlug]/actions.ts#answerChoiceCheck": {
    allowed: "learnerA",
    path: (world) => `/lessons/${world.lessonSlug}`,
    fields: (world) => ({ lessonSlug: world.lessonSlug, checkId: world.choiceCheckId, choice: "A" }),
    guarded: ["lessonSlug", "checkId"],
  },
  "app/(learn)/bench/[exerciseSlug]/actions.ts#startBenchDraft": {
    allowed: "learnerA",
    path: () => `/bench/${benchExercise}`,
    bound: () => [benchExercise],
    guardedArgs: [0],
  },
  "app/(learn)/bench/[exerciseSlug]/actions.ts#submitBenchWork": {
    allowed: "learnerA",
    path: () => `/bench/${benchExercise}`,
    bound: async (world, persona) => {
      await draftWithPhoto(world, persona);
      return [benchExercise];
    },
    fields: () => statedRun,
    guarded: ["cable"],
    guardedArgs: [0],
  },
  "app/(learn)/bench/[exerciseSlug]/actions.ts#deleteBenchPhoto": {
    allowed: "learnerA",
    path: () => `/bench/${benchExercise}`,
    // Always learner A's photo: for learner B it is somebody else's.
    bound: async (world) => [benchExercise, (await draftWithPhoto(world, "learnerA"))[0]],
    guardedArgs: [1],
  },
  "app/(teach)/reviews/[submissionId]/actions.ts#submitReview": {
    allowed: "instructorA",
    path: (world) => `/reviews/${world.reviewSubmissionId}`,
    bound: async (world) => [await world.submitWork(await world.createLearner())],
    fields: () => ({ ...rubricScores(), feedback: "Clear photo at the first pixel; the stated rise time matches it.", decision: "accept" }),
    guarded: ["decision"],
    guardedArgs: [0],
  },
  "app/(auth)/sign-in/actions.ts#signIn": {
    allowed: "learnerA",
    path: () => "/sign-in",
    fields: async (world) => ({ email: (await world.createLearner()).email, password: personPassword }),
    guarded: ["email", "password"],
    session: throwawaySession,
    bookkeeping: ["rate_limits"],
  },
  "app/(auth)/sign-out/actions.ts#signOut": {
    allowed: "learnerA",
    path: () => "/sign-out",
    bound: () => [],
    session: throwawaySession,
  },
  "app/(auth)/reset-password/actions.ts#requestPasswordResetAction": {
    allowed: "learnerA",
    path: () => "/reset-password",
    // An address without an account: the answer is the same, and no e-mail goes out.
    fields: () => ({ email: accessAddress("nobody") }),
    guarded: ["email"],
  },
  "app/(auth)/reset-password/[token]/actions.ts#completePasswordResetAction": {
    allowed: "learnerA",
    path: (world) => `/reset-password/${world.resetToken}`,
    fields: async (world) => ({ token: await world.createResetToken(), password: actionPassword, confirmPassword: actionPassword }),
    guarded: ["token"],
    session: throwawaySession,
  },
  "app/(auth)/invitations/[token]/actions.ts#acceptInvitationAction": {
    allowed: "learnerA",
    path: (world) => `/invitations/${world.invitationToken}`,
    fields: async (world) => ({ token: await world.createInvitation(), name: "Wren Accepting", password: actionPassword, confirmPassword: actionPassword }),
    guarded: ["token"],
    session: throwawaySession,
  },
  "app/(admin)/certificates/actions.ts#revokeCertificateAction": {
    allowed: "admin",
    path: () => "/certificates",
    fields: async (world) => ({ certificateId: (await world.createCertificate()).id, reason: "Issued in error during a records check." }),
    guarded: ["certificateId"],
  },
  // Any text of sensible length is a name or a role, so only the form as a whole can be spoiled.
  "app/(admin)/certificates/actions.ts#saveSignatoryAction": {
    allowed: "admin",
    path: () => "/certificates",
    fields: () => ({ signatoryName: "Access Signatory", signatoryRole: "Head of the access department" }),
    guarded: [],
  },
  "app/(admin)/admin/actions.ts#invitePerson": {
    allowed: "admin",
    path: () => "/admin",
    fields: (world) => ({ email: accessAddress("invitee"), role: "learner", cohortId: world.cohortA }),
    guarded: ["email", "role"],
  },
  "app/(admin)/admin/cohorts/actions.ts#saveCohortAction": {
    allowed: "admin",
    path: (world) => `/admin/cohorts/${world.spareCohort}/edit`,
    fields: (world) => ({
      cohortId: world.spareCohort,
      name: `Access spare cohort ${world.spareCohort.slice(0, 8)}`,
      courseSlug: getCourse().slug,
      startsOn: "2026-09-07",
      endsOn: "2027-03-26",
    }),
    guarded: ["courseSlug", "startsOn", "endsOn"],
  },
  "app/(admin)/admin/cohorts/[cohortId]/actions.ts#enrolLearnerAction": {
    allowed: "admin",
    path: (world) => `/admin/cohorts/${world.spareCohort}`,
    fields: (world) => ({ cohortId: world.spareCohort, name: "Ivo Enrolling", email: accessAddress("enrolee") }),
    guarded: ["cohortId", "email"],
  },
  "app/(admin)/admin/cohorts/[cohortId]/actions.ts#resendWaitingAction": {
    allowed: "admin",
    path: (world) => `/admin/cohorts/${world.spareCohort}`,
    fields: (world) => ({ cohortId: world.spareCohort }),
    guarded: ["cohortId"],
  },
  "app/(admin)/admin/cohorts/[cohortId]/import/actions.ts#rosterImportAction": {
    allowed: "admin",
    path: (world) => `/admin/cohorts/${world.spareCohort}/import`,
    fields: (world) => ({
      intent: "import",
      cohortId: world.spareCohort,
      expectedValid: "1",
      file: new File([`name,email\nOla Importing,${accessAddress("imported")}\n`], "roster.csv", { type: "text/csv" }),
    }),
    guarded: ["intent", "cohortId", "file"],
  },
  "app/(admin)/admin/entry-actions.ts#rosterEntryAction": {
    allowed: "admin",
    path: (world) => `/admin/cohorts/${world.cohortA}`,
    fields: async (world) => ({ intent: "deactivate", cohortId: world.cohortA, userId: (await world.createLearner()).id }),
    guarded: ["intent", "userId"],
  },
};

export function formDataOf(fields: Record<string, FieldValue>): FormData {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  return form;
}

/** A call the action accepts from an allowed persona; `fields` replaces the form it sends. */
export async function planActionCall(
  form: ActionForm,
  world: AccessWorld,
  persona: Persona,
  cookie: string,
  fields?: Record<string, FieldValue> | FormData,
): Promise<ActionCallPlan> {
  const bound = form.bound ? await form.bound(world, persona) : [];
  const session = form.session ? await form.session(world, persona) : cookie;
  if (!form.fields) return { path: form.path(world), args: bound, cookie: session };
  const sent = fields instanceof FormData ? fields : formDataOf(fields ?? (await form.fields(world, persona)));
  return { path: form.path(world), args: [...bound, idleState, sent], cookie: session };
}
