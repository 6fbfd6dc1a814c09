/**
 * Who may do what, walked over HTTP against the running production build and its database:
 * every page, every route handler method and every server action, as seven personas. A page,
 * handler or action the table does not list fails the coverage test, so a new route cannot ship
 * without its row. Server actions are called as the browser calls them (Next-Action header,
 * arguments encoded by React); a refused call must leave the database exactly as it was.
 */
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { homePathFor } from "@/lib/auth/permissions";
import { protectedRoutes } from "@/lib/auth/route-access";
import { uniqueLoopbackAddress } from "../support/loopback-client";
import { actionForms, planActionCall } from "./support/action-forms";
import { benchExercise, cookieOf, gradedLab, personas, reviewedExercise, setUpAccessWorld, type AccessWorld, type Persona } from "./support/access-world";
import { builtActionId, discoverPages, discoverRouteHandlers, discoverServerActions, readBuiltActions } from "./support/app-surface";
import { baseUrl } from "./support/browser";
import { changedTables, readDatabaseState } from "./support/database-state";
import { callAction, isRefusalState, type ActionReply } from "./support/server-actions";

// Pages: 200, "sign-in" (307 to /sign-in, with the way back for protected pages), "home" (307 to
// the persona's own start page), 403 (the app's forbidden page), 404, or "locked" (200 with the page
// that says which lesson to finish first, and nothing of the locked content).
type PageOutcome = 200 | 403 | 404 | "sign-in" | "home" | "locked";
// Server actions: "sign-in" (sent to sign in), 403, "refused" (the action's own refusal, such as
// "not part of your school") or "accepted" (its success answer). Refusals write nothing.
type ActionOutcome = "sign-in" | 403 | "refused" | "accepted";
type Row<Outcome> = readonly [Outcome, Outcome, Outcome, Outcome, Outcome, Outcome, Outcome];

const everyone200: Row<PageOutcome> = [200, 200, 200, 200, 200, 200, 200];
const publicOnly: Row<PageOutcome> = [200, "home", "home", "home", "home", "home", "home"];
const learnerPage: Row<PageOutcome> = ["sign-in", 200, 200, 403, 403, 403, 403];
const instructorPage: Row<PageOutcome> = ["sign-in", 403, 403, 200, 200, 403, 403];
const adminPage: Row<PageOutcome> = ["sign-in", 403, 403, 403, 403, 200, 200];
const cohortAPage: Row<PageOutcome> = ["sign-in", 403, 403, 200, 404, 200, 404];
const cohortAAdminPage: Row<PageOutcome> = ["sign-in", 403, 403, 403, 403, 200, 404];

type PageCase = { path: (world: AccessWorld) => string; expect: Row<PageOutcome> };

//                                                        anonymous learnerA learnerB instructorA instructorB admin otherAdmin
const pageTable: Record<string, PageCase[]> = {
  "/": [{ path: () => "/", expect: publicOnly }],
  "/sign-in": [{ path: () => "/sign-in", expect: publicOnly }],
  "/sign-out": [{ path: () => "/sign-out", expect: ["sign-in", 200, 200, 200, 200, 200, 200] }],
  "/reset-password": [{ path: () => "/reset-password", expect: everyone200 }],
  "/reset-password/[token]": [{ path: (w) => `/reset-password/${w.resetToken}`, expect: everyone200 }],
  "/invitations/[token]": [{ path: (w) => `/invitations/${w.invitationToken}`, expect: everyone200 }],
  "/verify": [{ path: () => "/verify", expect: everyone200 }],
  "/c/[code]": [{ path: (w) => `/c/${w.certificateCode}`, expect: everyone200 }],
  "/learn": [{ path: () => "/learn", expect: learnerPage }],
  "/lessons/[lessonSlug]": [{ path: (w) => `/lessons/${w.lessonSlug}`, expect: learnerPage }],
  "/labs/[labSlug]": [{ path: () => `/labs/${gradedLab.slug}`, expect: learnerPage }],
  // Bench exercises open with their lessons: learner B is still at lesson 6, before both of them.
  "/bench/[exerciseSlug]": [
    { path: () => `/bench/${benchExercise}`, expect: ["sign-in", 200, "locked", 403, 403, 403, 403] },
    { path: () => `/bench/${reviewedExercise}`, expect: ["sign-in", 200, "locked", 403, 403, 403, 403] },
  ],
  "/certificate": [{ path: () => "/certificate", expect: learnerPage }],
  "/cohorts": [{ path: () => "/cohorts", expect: instructorPage }],
  "/cohorts/[cohortId]": [{ path: (w) => `/cohorts/${w.cohortA}`, expect: cohortAPage }],
  "/cohorts/[cohortId]/learners/[learnerId]": [
    { path: (w) => `/cohorts/${w.cohortA}/learners/${w.people.learnerA.id}`, expect: cohortAPage },
    // A learner of cohort B asked for under cohort A's address: not in that cohort, so not found.
    { path: (w) => `/cohorts/${w.cohortA}/learners/${w.people.learnerB.id}`, expect: ["sign-in", 403, 403, 404, 404, 404, 404] },
  ],
  "/reviews": [{ path: () => "/reviews", expect: instructorPage }],
  "/reviews/[submissionId]": [{ path: (w) => `/reviews/${w.reviewSubmissionId}`, expect: ["sign-in", 403, 403, 200, 404, 403, 403] }],
  "/admin": [{ path: () => "/admin", expect: adminPage }],
  "/admin/cohorts/new": [{ path: () => "/admin/cohorts/new", expect: adminPage }],
  "/admin/cohorts/[cohortId]": [{ path: (w) => `/admin/cohorts/${w.cohortA}`, expect: cohortAAdminPage }],
  "/admin/cohorts/[cohortId]/edit": [{ path: (w) => `/admin/cohorts/${w.cohortA}/edit`, expect: cohortAAdminPage }],
  "/admin/cohorts/[cohortId]/import": [{ path: (w) => `/admin/cohorts/${w.cohortA}/import`, expect: cohortAAdminPage }],
  "/certificates": [{ path: () => "/certificates", expect: adminPage }],
  // The development mail viewer (only served while the local mail sink runs) is for any admin.
  "/dev/mail": [{ path: () => "/dev/mail", expect: adminPage }],
};

type HandlerCase = { path: (world: AccessWorld) => string; body?: (world: AccessWorld) => unknown; expect: Row<number> };
const uploadPath = () => "/api/uploadthing?actionType=upload&slug=benchPhoto";
const uploadBody = (submissionId: string) => ({
  files: [{ name: "scope.png", size: 1000, type: "image/png", lastModified: Date.now() }],
  input: { submissionId },
});

//                                                             anonymous learnerA learnerB instructorA instructorB admin otherAdmin
const handlerTable: Record<string, HandlerCase | HandlerCase[]> = {
  "GET /api/health": { path: () => "/api/health", expect: [200, 200, 200, 200, 200, 200, 200] },
  "GET /api/bench-photos/[photoId]": { path: (w) => `/api/bench-photos/${w.photoId}`, expect: [401, 200, 404, 200, 404, 404, 404] },
  "GET /api/certificates/[certificateId]/pdf": { path: (w) => `/api/certificates/${w.certificateId}/pdf`, expect: [401, 200, 404, 404, 404, 200, 404] },
  "GET /api/certificates/verify/[code]": { path: (w) => `/api/certificates/verify/${w.certificateCode}`, expect: [200, 200, 200, 200, 200, 200, 200] },
  "GET /api/cohorts/[cohortId]/gradebook.csv": { path: (w) => `/api/cohorts/${w.cohortA}/gradebook.csv`, expect: [401, 403, 403, 200, 404, 200, 404] },
  "GET /api/labs/[labSlug]/attempts": { path: () => `/api/labs/${gradedLab.slug}/attempts`, expect: [401, 200, 200, 403, 403, 403, 403] },
  "POST /api/labs/[labSlug]/attempts": {
    path: () => `/api/labs/${gradedLab.slug}/attempts`,
    body: () => ({ choices: gradedLab.choices, idempotencyKey: randomUUID() }),
    expect: [401, 201, 201, 403, 403, 403, 403],
  },
  // Each learner saves their own workbench: there is no other learner's to reach.
  "POST /api/labs/[labSlug]/draft": {
    path: () => `/api/labs/${gradedLab.slug}/draft`,
    body: () => ({ choices: gradedLab.choices, answers: {} }),
    expect: [401, 200, 200, 403, 403, 403, 403],
  },
  "GET /api/labs/[labSlug]/attempts/[attemptId]": { path: (w) => `/api/labs/${gradedLab.slug}/attempts/${w.attemptId}`, expect: [401, 200, 404, 403, 403, 403, 403] },
  "GET /api/uploadthing": { path: () => "/api/uploadthing", expect: [200, 200, 200, 200, 200, 200, 200] },
  "POST /api/uploadthing": [
    // The browser's request to upload a photo to learner A's bench draft.
    { path: uploadPath, body: (w) => uploadBody(w.draftSubmissionId), expect: [401, 200, 404, 403, 403, 403, 403] },
    // To learner B's own draft of an exercise whose lesson is locked to them: refused like a new draft.
    { path: uploadPath, body: (w) => uploadBody(w.lockedDraftSubmissionId), expect: [401, 404, 403, 403, 403, 403, 403] },
  ],
};

//                                                                                         anonymous learnerA  learnerB  instructorA instructorB admin    otherAdmin
const learnerAction: Row<ActionOutcome> = ["sign-in", "accepted", "accepted", 403, 403, 403, 403];
const schoolAdminAction: Row<ActionOutcome> = ["sign-in", 403, 403, 403, 403, "accepted", "refused"];
const openToAll: Row<ActionOutcome> = ["accepted", "accepted", "accepted", "accepted", "accepted", "accepted", "accepted"];

// Starting and handing in bench work: the exercise's lesson is locked to learner B, so B is refused.
const openBenchOnlyAction: Row<ActionOutcome> = ["sign-in", "accepted", "refused", 403, 403, 403, 403];

const actionTable: Record<string, Row<ActionOutcome>> = {
  "app/(learn)/lessons/[lessonSlug]/actions.ts#answerQuickCheck": learnerAction,
  "app/(learn)/lessons/[lessonSlug]/actions.ts#answerChoiceCheck": learnerAction,
  "app/(learn)/bench/[exerciseSlug]/actions.ts#startBenchDraft": openBenchOnlyAction,
  "app/(learn)/bench/[exerciseSlug]/actions.ts#submitBenchWork": openBenchOnlyAction,
  // Learner A's photo: learner B is told it is already gone.
  "app/(learn)/bench/[exerciseSlug]/actions.ts#deleteBenchPhoto": ["sign-in", "accepted", "refused", 403, 403, 403, 403],
  // Work of a learner of cohort A: only cohort A's instructor reviews it.
  "app/(teach)/reviews/[submissionId]/actions.ts#submitReview": ["sign-in", 403, 403, "accepted", "refused", 403, 403],
  "app/(auth)/sign-in/actions.ts#signIn": openToAll,
  "app/(auth)/sign-out/actions.ts#signOut": openToAll,
  "app/(auth)/reset-password/actions.ts#requestPasswordResetAction": openToAll,
  "app/(auth)/reset-password/[token]/actions.ts#completePasswordResetAction": openToAll,
  "app/(auth)/invitations/[token]/actions.ts#acceptInvitationAction": openToAll,
  // Fernhallow's certificates, cohorts, learners and invitations: the other school's admin is refused.
  "app/(admin)/certificates/actions.ts#revokeCertificateAction": schoolAdminAction,
  // Each admin names the signatory of their own school.
  "app/(admin)/certificates/actions.ts#saveSignatoryAction": ["sign-in", 403, 403, 403, 403, "accepted", "accepted"],
  "app/(admin)/admin/actions.ts#invitePerson": schoolAdminAction,
  "app/(admin)/admin/cohorts/actions.ts#saveCohortAction": schoolAdminAction,
  "app/(admin)/admin/cohorts/[cohortId]/actions.ts#enrolLearnerAction": schoolAdminAction,
  "app/(admin)/admin/cohorts/[cohortId]/actions.ts#resendWaitingAction": schoolAdminAction,
  "app/(admin)/admin/cohorts/[cohortId]/import/actions.ts#rosterImportAction": schoolAdminAction,
  "app/(admin)/admin/entry-actions.ts#rosterEntryAction": schoolAdminAction,
};

const homeOf: Record<Persona, string | null> = {
  anonymous: null,
  learnerA: homePathFor("learner"),
  learnerB: homePathFor("learner"),
  instructorA: homePathFor("instructor"),
  instructorB: homePathFor("instructor"),
  admin: homePathFor("admin"),
  otherAdmin: homePathFor("admin"),
};

let world: AccessWorld;
setUpAccessWorld((built) => (world = built));

async function pageOutcome(persona: Persona, path: string, protectedPage: boolean): Promise<PageOutcome | string> {
  const cookie = cookieOf(world, persona);
  const response = await fetch(`${baseUrl}${path}`, { redirect: "manual", headers: cookie ? { cookie } : {} });
  const body = await response.text();
  if (response.status === 307) {
    const location = new URL(response.headers.get("location")!, baseUrl);
    if (location.pathname === "/sign-in" && (!protectedPage || location.searchParams.get("next") === path)) return "sign-in";
    if (location.pathname === homeOf[persona]) return "home";
    return `307 to ${location.pathname}${location.search}`;
  }
  if (response.status === 403 && !body.includes("This page is not open to your account")) return "403 without the forbidden page";
  if (response.status === 200 && /Finish lesson \d+ first/.test(body)) return "locked";
  return response.status as PageOutcome;
}

/** What one action call came to, in the table's words (or a description of anything else). */
function actionOutcome(reply: ActionReply): ActionOutcome | string {
  if (reply.redirect) {
    const target = new URL(reply.redirect, baseUrl);
    return target.pathname === "/sign-in" && !target.searchParams.has("notice") ? "sign-in" : "accepted";
  }
  if (reply.status === 403) return 403;
  if (reply.status !== 200 || reply.threw) return `${reply.status}${reply.threw ? " (threw)" : ""}`;
  return isRefusalState(reply.result) ? "refused" : "accepted";
}

describe("the authorization matrix", () => {
  it("has a row for every page, route handler and server action the app has", () => {
    expect(Object.keys(pageTable).sort()).toEqual(discoverPages());
    expect(Object.keys(handlerTable).sort()).toEqual(discoverRouteHandlers());
    expect(Object.keys(actionTable).sort()).toEqual(discoverServerActions());
    expect(Object.keys(actionForms).sort()).toEqual(discoverServerActions());
    const built = readBuiltActions();
    for (const key of discoverServerActions()) expect(built.has(key), `${key} is missing from the build's action manifest`).toBe(true);
  });

  it("lists every protected page as protected in the route table, and no public page", () => {
    const protectedPatterns = Object.entries(pageTable)
      .filter(([, cases]) => cases[0]!.expect[0] === "sign-in" && cases[0]!.expect.slice(1).some((outcome) => outcome !== 200))
      .map(([pattern]) => pattern);
    expect(protectedPatterns.sort()).toEqual(Object.keys(protectedRoutes).sort());
  });

  it("answers every page as the table says, for every persona", async () => {
    const seen: string[] = [];
    const expected: string[] = [];
    for (const [pattern, cases] of Object.entries(pageTable)) {
      const protectedPage = pattern in protectedRoutes;
      for (const { path, expect: row } of cases) {
        const concrete = path(world);
        for (const [index, persona] of personas.entries()) {
          seen.push(`${persona} ${concrete} → ${await pageOutcome(persona, concrete, protectedPage)}`);
          expected.push(`${persona} ${concrete} → ${row[index]}`);
        }
      }
    }
    expect(seen).toEqual(expected);
  });

  it("answers every route handler as the table says, for every persona", async () => {
    const seen: string[] = [];
    const expected: string[] = [];
    for (const [key, entry] of Object.entries(handlerTable)) {
      const method = key.split(" ")[0]!;
      for (const { path, body, expect: row } of Array.isArray(entry) ? entry : [entry]) {
        for (const [index, persona] of personas.entries()) {
          const cookie = cookieOf(world, persona);
          const payload = body?.(world);
          const response = await fetch(`${baseUrl}${path(world)}`, {
            method,
            redirect: "manual",
            headers: { ...(cookie ? { cookie } : {}), ...(payload ? { "content-type": "application/json" } : {}) },
            body: payload ? JSON.stringify(payload) : undefined,
          });
          await response.arrayBuffer();
          seen.push(`${persona} ${key} → ${response.status}`);
          expected.push(`${persona} ${key} → ${row[index]}`);
        }
      }
    }
    expect(seen).toEqual(expected);
  });

  it("runs every server action only for the personas the table allows, and a refusal writes nothing", async () => {
    const seen: string[] = [];
    const expected: string[] = [];
    for (const [key, row] of Object.entries(actionTable)) {
      const form = actionForms[key]!;
      for (const [index, persona] of personas.entries()) {
        const plan = await planActionCall(form, world, persona, cookieOf(world, persona));
        const before = await readDatabaseState();
        // Each call from its own client address, so the matrix's sign-ins never trip the sign-in throttle.
        const reply = await callAction({ ...plan, actionId: builtActionId(key), from: uniqueLoopbackAddress() });
        const outcome = actionOutcome(reply);
        const changed = changedTables(before, await readDatabaseState());
        const wroteOnRefusal = outcome !== "accepted" && changed.length > 0 ? ` but wrote to ${changed.join(", ")}` : "";
        seen.push(`${persona} ${key} → ${outcome}${wroteOnRefusal}`);
        expected.push(`${persona} ${key} → ${row[index]}`);
      }
    }
    expect(seen).toEqual(expected);
  });
});
