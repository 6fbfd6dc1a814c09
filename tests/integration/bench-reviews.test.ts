/**
 * Who may see bench photos and review bench work, with real sessions of every role, a real upload
 * fake and the real mail sink; and the review's e-mail with its link to the exercise page.
 */
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as getBenchPhoto } from "@/app/api/bench-photos/[photoId]/route";
import { db } from "@/db/client";
import { findBenchSubmissionForReviewer, listBenchReviewQueue, listBenchReviews } from "@/db/queries/bench";
import { benchSubmissions } from "@/db/schema";
import { handInBenchWork, openBenchDraft } from "@/lib/bench/submissions";
import { reviewBenchWork, type ReviewInput } from "@/lib/bench/reviews";
import { findLinks } from "@/lib/mail/sink";
import { statedRun } from "../support/bench-run";
import { noisyPhoto } from "../support/uploads/noisy-photo";
import { createBenchSchool, type BenchSchool, type SignedIn } from "./support/bench-people";
import { startBenchUploadService, type BenchUploadService } from "./support/bench-upload-service";
import { countMessagesTo, waitForMessage } from "./support/mail-sink";

let service: BenchUploadService;
let people: BenchSchool;

function formOf(values: Record<string, string>): FormData {
  const form = new FormData();
  for (const [name, value] of Object.entries(values)) form.set(name, value);
  return form;
}

/** A learner of the home cohort whose work on "build-a-run" waits for review, with one photo. */
async function workWaitingForReview(): Promise<{ learner: SignedIn; submissionId: string; photoId: string }> {
  const learner = await people.createMember(people.homeCohortId, "learner", "bench-reviewed");
  const draft = await openBenchDraft({ learner: learner.user, exerciseSlug: "build-a-run" });
  if (draft.status !== "ready") throw new Error(`no draft: ${draft.status}`);
  const file = new File([new Uint8Array(noisyPhoto(64, 48))], "edge.png", { type: "image/png" });
  const [uploaded] = await service.upload({ files: [file], submissionId: draft.submissionId, cookie: learner.cookie });
  const photoId = (uploaded.serverData as { photoId: string }).photoId;
  const handed = await handInBenchWork({ learner: learner.user, exerciseSlug: "build-a-run", formData: formOf(statedRun) });
  expect(handed).toEqual({ status: "submitted" });
  return { learner, submissionId: draft.submissionId, photoId };
}

const fullMarks: ReviewInput = {
  scores: { "measurement-correct": "3", "trace-readable": "2", "conclusion-sound": "1", "design-worked": "3" },
  feedback: "Clean measurement at the first pixel. Say why the rise time beats the prediction by 2 ns.",
  decision: "accept",
};

const photoStatus = async (photoId: string, viewer?: SignedIn) =>
  (
    await getBenchPhoto(new Request(`http://app.test/api/bench-photos/${photoId}`, { headers: viewer ? { cookie: viewer.cookie } : {} }), {
      params: Promise.resolve({ photoId }),
    })
  ).status;

beforeAll(async () => {
  service = await startBenchUploadService();
  people = await createBenchSchool();
});

afterAll(async () => {
  await service?.stop();
});

describe("bench photo access", () => {
  it("serves a photo to its learner and their cohort's instructors, and answers 404 to everyone else", async () => {
    const { learner, photoId } = await workWaitingForReview();
    expect(await photoStatus(photoId, learner)).toBe(200);
    expect(await photoStatus(photoId, people.homeInstructor)).toBe(200);
    expect(await photoStatus(photoId, people.otherInstructor)).toBe(404);
    expect(await photoStatus(photoId, people.otherLearner)).toBe(404);
    expect(await photoStatus(photoId, people.admin)).toBe(404);
    expect(await photoStatus(photoId)).toBe(401);
  });

  it("answers an unknown or malformed id exactly as a photo the viewer may not see", async () => {
    expect(await photoStatus("6f1c1f55-2f38-4c8e-9d8e-2b8f1d0b7a10", people.homeInstructor)).toBe(404);
    expect(await photoStatus("not-an-id", people.homeInstructor)).toBe(404);
  });
});

describe("the review queue", () => {
  it("lists work waiting in the instructor's own cohorts only, longest waiting first", async () => {
    const first = await workWaitingForReview();
    const second = await workWaitingForReview();
    await db.update(benchSubmissions).set({ submittedAt: new Date(Date.now() - 3 * 86_400_000) }).where(eq(benchSubmissions.id, second.submissionId));

    const queue = (await listBenchReviewQueue({ instructorId: people.homeInstructor.user.id })).map((e) => e.submissionId);
    expect(queue.indexOf(second.submissionId)).toBeGreaterThanOrEqual(0);
    expect(queue.indexOf(second.submissionId)).toBeLessThan(queue.indexOf(first.submissionId));
    const elsewhere = (await listBenchReviewQueue({ instructorId: people.otherInstructor.user.id })).map((e) => e.submissionId);
    expect(elsewhere).not.toContain(first.submissionId);
    expect(elsewhere).not.toContain(second.submissionId);
  });

  it("opens the review page's data only for an instructor of the submission's cohort", async () => {
    const { submissionId } = await workWaitingForReview();
    expect(await findBenchSubmissionForReviewer({ submissionId, instructorId: people.homeInstructor.user.id })).toMatchObject({ id: submissionId });
    expect(await findBenchSubmissionForReviewer({ submissionId, instructorId: people.otherInstructor.user.id })).toBeUndefined();
  });
});

describe("reviewing bench work", () => {
  it("is refused to learners and admins, and to instructors of another cohort as if the work did not exist", async () => {
    const { learner, submissionId } = await workWaitingForReview();
    expect(await reviewBenchWork({ reviewer: learner.user, submissionId, input: fullMarks })).toEqual({ status: "forbidden" });
    expect(await reviewBenchWork({ reviewer: people.otherLearner.user, submissionId, input: fullMarks })).toEqual({ status: "forbidden" });
    expect(await reviewBenchWork({ reviewer: people.admin.user, submissionId, input: fullMarks })).toEqual({ status: "forbidden" });
    expect(await reviewBenchWork({ reviewer: people.otherInstructor.user, submissionId, input: fullMarks })).toEqual({ status: "not-found" });
    expect(await listBenchReviews({ submissionId })).toEqual([]);
  });

  it("rejects points outside each criterion's range and empty feedback, naming the fields", async () => {
    const { submissionId } = await workWaitingForReview();
    const outcome = await reviewBenchWork({
      reviewer: people.homeInstructor.user,
      submissionId,
      input: { scores: { "measurement-correct": "-1", "trace-readable": "2", "conclusion-sound": "1.5", "design-worked": "5" }, feedback: "  ", decision: "maybe" },
    });
    expect(outcome).toEqual({
      status: "invalid",
      fieldErrors: {
        "score-measurement-correct": "Give 0 to 3 points.",
        "score-conclusion-sound": "Give a whole number of points, 0 to 2.",
        "score-design-worked": "At most 3 points here.",
        feedback: expect.stringContaining("Write feedback"),
        decision: "Choose accept or return.",
      },
    });
    expect(await listBenchReviews({ submissionId })).toEqual([]);
  });

  it("records an acceptance once, and e-mails the learner a link to the exercise page", async () => {
    const { learner, submissionId } = await workWaitingForReview();
    const outcome = await reviewBenchWork({ reviewer: people.homeInstructor.user, submissionId, input: fullMarks });
    expect(outcome).toEqual({ status: "recorded", decision: "accept", total: 9, maxTotal: 10, emailed: true });

    const [review] = await listBenchReviews({ submissionId });
    expect(review).toMatchObject({ scores: { "measurement-correct": 3, "trace-readable": 2, "conclusion-sound": 1, "design-worked": 3 }, total: 9, maxTotal: 10, decision: "accept", reviewerName: "Test instructor" });
    const [stored] = await db.select().from(benchSubmissions).where(eq(benchSubmissions.id, submissionId));
    expect(stored!.status).toBe("accepted");

    const message = await waitForMessage({ to: learner.user.email, subject: /accepted/ });
    expect(message.subject).toBe("Bench work accepted: Build and measure a run of your design");
    expect(message.text).toContain("and accepted it with 9 of 10 points.");
    expect(findLinks(message.text)).toEqual([`${process.env.APP_URL}/bench/build-a-run`]);
    expect(message.html).toContain(`href="${process.env.APP_URL}/bench/build-a-run"`);

    expect(await reviewBenchWork({ reviewer: people.homeInstructor.user, submissionId, input: fullMarks })).toEqual({ status: "not-waiting" });
    expect(await listBenchReviews({ submissionId })).toHaveLength(1);
    expect(await countMessagesTo(learner.user.email)).toBe(1);
  });

  it("returns work for rework, which the learner may then change and hand in again", async () => {
    const { learner, submissionId } = await workWaitingForReview();
    const outcome = await reviewBenchWork({
      reviewer: people.homeInstructor.user,
      submissionId,
      input: { ...fullMarks, scores: { "measurement-correct": "1", "trace-readable": "1", "conclusion-sound": "0", "design-worked": "1" }, decision: "return" },
    });
    expect(outcome).toMatchObject({ status: "recorded", decision: "return", total: 3 });
    const message = await waitForMessage({ to: learner.user.email, subject: /returned/ });
    expect(findLinks(message.text)).toEqual([`${process.env.APP_URL}/bench/build-a-run`]);

    const again = await handInBenchWork({ learner: learner.user, exerciseSlug: "build-a-run", formData: formOf({ ...statedRun, resistor: "27 ohm" }) });
    expect(again).toEqual({ status: "submitted" });
    const [stored] = await db.select().from(benchSubmissions).where(eq(benchSubmissions.id, submissionId));
    expect(stored).toMatchObject({ status: "submitted", seriesResistanceOhm: 27 });
  });
});

describe("handing in bench work", () => {
  it("refuses values it cannot read, naming the field and keeping what was typed", async () => {
    const learner = await people.createMember(people.homeCohortId, "learner", "bench-typo");
    const outcome = await handInBenchWork({
      learner: learner.user,
      exerciseSlug: "build-a-run",
      formData: formOf({ ...statedRun, "rise-time": "14", length: "12 km", cable: "garden-hose" }),
    });
    expect(outcome).toMatchObject({
      status: "invalid",
      fieldErrors: {
        "rise-time": expect.stringContaining("has no unit"),
        length: expect.stringContaining("outside what a bench run gives"),
        cable: "Choose the cable you used from the list.",
      },
      entries: { "rise-time": "14", length: "12 km" },
    });
  });

  it("needs at least one photo", async () => {
    const learner = await people.createMember(people.homeCohortId, "learner", "bench-no-photo");
    expect(await handInBenchWork({ learner: learner.user, exerciseSlug: "build-a-run", formData: formOf(statedRun) })).toMatchObject({
      status: "photo-count",
      photos: 0,
    });
  });

  it("is refused to a learner outside any cohort of the course and to other roles", async () => {
    const loner = await people.createMember(null, "learner", "bench-loner");
    expect(await openBenchDraft({ learner: loner.user, exerciseSlug: "build-a-run" })).toEqual({ status: "no-cohort" });
    expect(await openBenchDraft({ learner: people.homeInstructor.user, exerciseSlug: "build-a-run" })).toEqual({ status: "forbidden" });
    expect(await openBenchDraft({ learner: people.otherLearner.user, exerciseSlug: "no-such-bench" })).toEqual({ status: "not-found" });
  });
});
