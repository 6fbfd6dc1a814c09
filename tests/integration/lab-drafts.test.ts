/**
 * The workbench's saved choices against the real database: the route handler is called with a
 * Request carrying a real session cookie, and the lab page's opening draft is read back from what
 * was stored.
 */
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as saveDraft } from "@/app/api/labs/[labSlug]/draft/route";
import { db } from "@/db/client";
import { findLabDraft } from "@/db/queries/lab-drafts";
import { markLessonsCompleted } from "@/db/queries/progress";
import { labDrafts } from "@/db/schema";
import { getCourse, getLab, getLessonOfLab, labVariant } from "@/lessons";
import { createSession } from "@/lib/auth/session-store";
import { variantSeedFor } from "@/lib/grading";
import { openingDraft, scenarioDraft } from "@/lib/lab-drafts";
import { createPerson } from "./support/people";

type Person = { id: string; cookie: string };

async function signedIn(role: "learner" | "instructor", readyFor?: string): Promise<Person> {
  const person = await createPerson({ role, password: "saved at the workbench" });
  if (readyFor) {
    const number = getLessonOfLab(readyFor)!.number;
    const earlier = getCourse().lessons.filter((lesson) => lesson.number < number);
    await markLessonsCompleted({ userId: person.id, completions: earlier.map((lesson) => ({ lessonSlug: lesson.slug, completedAt: new Date() })) });
  }
  const cookie = await createSession(person.id);
  return { id: person.id, cookie: `${cookie.name}=${cookie.value}` };
}

async function save(person: Person | undefined, labSlug: string, body: unknown) {
  const request = new Request(`http://127.0.0.1/api/labs/${labSlug}/draft`, {
    method: "POST",
    headers: { "content-type": "application/json", ...(person && { cookie: person.cookie }) },
    body: JSON.stringify(body),
  });
  const response = await saveDraft(request, { params: Promise.resolve({ labSlug }) });
  return { status: response.status, json: (await response.json()) as { saved?: boolean; error?: { code: string; fieldErrors?: Record<string, string[]> } } };
}

async function opening(person: Person, labSlug: string) {
  const lab = getLab(labSlug)!;
  return openingDraft(lab, labVariant(lab, variantSeedFor(person.id, labSlug)), await findLabDraft({ userId: person.id, labSlug }));
}

describe("POST /api/labs/[labSlug]/draft", () => {
  it("keeps the latest choices of every run and the typed answers, and the lab opens with them", async () => {
    const learner = await signedIn("learner", "capstone-installation");
    const first = { arch: { seriesResistance: 150 }, facade: { seriesResistance: 43 }, canopy: { seriesResistance: 47 } };
    expect((await save(learner, "capstone-installation", { choices: first, answers: {} })).status).toBe(200);
    const latest = { ...first, canopy: { seriesResistance: 68 } };
    expect((await save(learner, "capstone-installation", { choices: latest, answers: {} })).json).toEqual({ saved: true });
    expect(await opening(learner, "capstone-installation")).toEqual({ choices: latest, answers: {} });
    const rows = await db.select().from(labDrafts).where(and(eq(labDrafts.userId, learner.id), eq(labDrafts.labSlug, "capstone-installation")));
    expect(rows).toHaveLength(1);

    const timing = await signedIn("learner", "timing-budget");
    // A 0's high time above a 1's is kept: the learner may be on the way between two settings.
    const midway = { main: { zeroHigh: 0.8e-6, oneHigh: 0.7e-6 } };
    const answers = { "frame-time": "11.1 ms", "refresh-rate": "90" };
    expect((await save(timing, "timing-budget", { choices: midway, answers })).status).toBe(200);
    expect(await opening(timing, "timing-budget")).toEqual({ choices: midway, answers });
  });

  it("opens a lab never saved, and a saved run that no longer fits, at the scenario's own choices", async () => {
    const learner = await signedIn("learner", "capstone-installation");
    const lab = getLab("capstone-installation")!;
    const start = scenarioDraft(lab, labVariant(lab, variantSeedFor(learner.id, lab.slug)));
    expect(await opening(learner, lab.slug)).toEqual(start);
    await db.insert(labDrafts).values({
      userId: learner.id,
      labSlug: lab.slug,
      choices: { arch: { seriesResistance: 151 }, facade: { seriesResistance: 100 }, canopy: "gone" },
      answers: { removed: "x" },
    });
    expect(await opening(learner, lab.slug)).toEqual({ choices: { ...start.choices, facade: { seriesResistance: 100 } }, answers: {} });
  });

  it("refuses a value the variant does not offer, an unknown question and an over-long answer, naming each field", async () => {
    const learner = await signedIn("learner", "lone-lead-termination");
    const offOffer = await save(learner, "lone-lead-termination", { choices: { main: { seriesResistance: 151 } }, answers: {} });
    expect(offOffer.status).toBe(422);
    expect(Object.keys(offOffer.json.error!.fieldErrors!)).toEqual(["choices.main.seriesResistance"]);
    const timing = await signedIn("learner", "timing-budget");
    const badAnswers = await save(timing, "timing-budget", { choices: { main: { zeroHigh: 0.4e-6, oneHigh: 0.8e-6 } }, answers: { "frame-time": "x".repeat(201), other: "1" } });
    expect(badAnswers.status).toBe(422);
    expect(Object.keys(badAnswers.json.error!.fieldErrors!).sort()).toEqual(["answers.frame-time", "answers.other"]);
    expect(await findLabDraft({ userId: learner.id, labSlug: "lone-lead-termination" })).toBeNull();
    expect(await findLabDraft({ userId: timing.id, labSlug: "timing-budget" })).toBeNull();
  });

  it("saves for a signed-in learner at an open lab only", async () => {
    const body = { choices: { main: { seriesResistance: 150 } }, answers: {} };
    expect((await save(undefined, "lone-lead-termination", body)).status).toBe(401);
    expect((await save(await signedIn("instructor"), "lone-lead-termination", body)).status).toBe(403);
    const early = await signedIn("learner");
    expect((await save(early, "lone-lead-termination", body)).status).toBe(403);
    expect(await findLabDraft({ userId: early.id, labSlug: "lone-lead-termination" })).toBeNull();
    expect((await save(early, "no-such-lab", body)).status).toBe(404);
  });
});
