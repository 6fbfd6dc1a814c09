import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { createCohort, findCohortForAdmin, listInstructorsBySchool, updateCohort } from "@/db/queries/admin-cohorts";
import { listCohortsBySchool } from "@/db/queries/cohorts";
import { cohortMemberships, cohorts } from "@/db/schema";
import { createSchoolAccount, createTestSchool, type TestSchool } from "./enrolment-fixtures";

// Creating and editing cohorts as a school admin, against the real database.

let school: TestSchool;
let instructors: { id: string; name: string }[];
beforeAll(async () => {
  school = await createTestSchool("cohorts");
  instructors = [
    await createSchoolAccount({ schoolId: school.schoolId, role: "instructor", name: "Vera Holt", email: `vera@${school.domain}` }),
    await createSchoolAccount({ schoolId: school.schoolId, role: "instructor", name: "Abel Sorensen", email: `abel@${school.domain}` }),
  ];
});

const fields = (name: string) => ({ name, courseSlug: "data-runs", startsOn: "2026-09-07", endsOn: "2026-12-11" });

async function instructorIdsOf(cohortId: string): Promise<string[]> {
  return (await findCohortForAdmin({ schoolId: school.schoolId, cohortId }))!.instructorIds.sort();
}

describe("cohorts", () => {
  it("creates a cohort with its instructors and lists it for the school", async () => {
    const created = await createCohort({ schoolId: school.schoolId, fields: fields("Autumn evenings"), instructorIds: [instructors[0]!.id] });
    if (!created.ok) throw new Error(created.reason);
    expect(await findCohortForAdmin({ schoolId: school.schoolId, cohortId: created.cohortId })).toMatchObject({
      ...fields("Autumn evenings"),
      schoolId: school.schoolId,
      instructorIds: [instructors[0]!.id],
    });
    const listed = await listCohortsBySchool({ schoolId: school.schoolId });
    expect(listed.find((c) => c.id === created.cohortId)).toMatchObject({ instructorNames: ["Vera Holt"], learnerCount: 0 });
  });

  it("answers a name the school already uses with a reason, not an error, and writes nothing", async () => {
    const before = await db.select().from(cohorts).where(eq(cohorts.schoolId, school.schoolId));
    expect(await createCohort({ schoolId: school.schoolId, fields: fields("Autumn evenings"), instructorIds: [] })).toEqual({
      ok: false,
      reason: "name-taken",
    });
    expect(await db.select().from(cohorts).where(eq(cohorts.schoolId, school.schoolId))).toHaveLength(before.length);
    const other = await createTestSchool("cohorts-other");
    expect((await createCohort({ schoolId: other.schoolId, fields: fields("Autumn evenings"), instructorIds: [] })).ok).toBe(true);
  });

  it("edits the fields and adds and removes instructors", async () => {
    const created = await createCohort({ schoolId: school.schoolId, fields: fields("Winter days"), instructorIds: [instructors[0]!.id] });
    if (!created.ok) throw new Error(created.reason);
    const both = [instructors[0]!.id, instructors[1]!.id];
    const edited = await updateCohort({
      schoolId: school.schoolId,
      cohortId: created.cohortId,
      fields: { ...fields("Winter days (moved)"), startsOn: "2027-01-11", endsOn: "2027-01-11" },
      instructorIds: both,
    });
    expect(edited).toEqual({ ok: true, cohortId: created.cohortId });
    expect(await findCohortForAdmin({ schoolId: school.schoolId, cohortId: created.cohortId })).toMatchObject({
      name: "Winter days (moved)",
      startsOn: "2027-01-11",
      endsOn: "2027-01-11",
    });
    expect(await instructorIdsOf(created.cohortId)).toEqual([...both].sort());

    await updateCohort({ schoolId: school.schoolId, cohortId: created.cohortId, fields: fields("Winter days"), instructorIds: [instructors[1]!.id] });
    expect(await instructorIdsOf(created.cohortId)).toEqual([instructors[1]!.id]);
    await updateCohort({ schoolId: school.schoolId, cohortId: created.cohortId, fields: fields("Winter days"), instructorIds: [] });
    expect(await instructorIdsOf(created.cohortId)).toEqual([]);
  });

  it("refuses renaming onto another cohort's name and keeps the cohort as it was", async () => {
    const created = await createCohort({ schoolId: school.schoolId, fields: fields("Spring block"), instructorIds: [instructors[0]!.id] });
    if (!created.ok) throw new Error(created.reason);
    expect(
      await updateCohort({ schoolId: school.schoolId, cohortId: created.cohortId, fields: fields("Autumn evenings"), instructorIds: [] }),
    ).toEqual({ ok: false, reason: "name-taken" });
    expect(await findCohortForAdmin({ schoolId: school.schoolId, cohortId: created.cohortId })).toMatchObject({
      name: "Spring block",
      instructorIds: [instructors[0]!.id],
    });
  });

  it("accepts only the school's own instructors, all or nothing", async () => {
    const learner = await createSchoolAccount({ schoolId: school.schoolId, role: "learner", name: "Uma Lee", email: `uma@${school.domain}` });
    const other = await createTestSchool("cohorts-foreign");
    const foreign = await createSchoolAccount({ schoolId: other.schoolId, role: "instructor", name: "Foreign Teacher", email: `t@${other.domain}` });
    for (const stranger of [learner.id, foreign.id]) {
      expect(
        await createCohort({ schoolId: school.schoolId, fields: fields(`Mixed ${stranger}`), instructorIds: [instructors[0]!.id, stranger] }),
      ).toEqual({ ok: false, reason: "unknown-instructor" });
      expect(await db.select().from(cohorts).where(eq(cohorts.name, `Mixed ${stranger}`))).toEqual([]);
    }
    expect((await listInstructorsBySchool({ schoolId: school.schoolId })).map((i) => i.name)).toEqual(["Abel Sorensen", "Vera Holt"]);
  });
});

describe("one school's admin and another school's cohorts", () => {
  it("cannot find, edit or staff them", async () => {
    const other = await createTestSchool("cohorts-intruder");
    expect(await findCohortForAdmin({ schoolId: other.schoolId, cohortId: school.cohortId })).toBeUndefined();
    expect(
      await updateCohort({ schoolId: other.schoolId, cohortId: school.cohortId, fields: fields("Taken over"), instructorIds: [] }),
    ).toEqual({ ok: false, reason: "not-found" });
    const [cohort] = await db.select().from(cohorts).where(eq(cohorts.id, school.cohortId));
    expect(cohort!.name).toBe(school.cohortName);
    expect((await listCohortsBySchool({ schoolId: other.schoolId })).map((c) => c.id)).not.toContain(school.cohortId);
    expect(await db.select().from(cohortMemberships).where(eq(cohortMemberships.userId, other.admin.id))).toEqual([]);
  });
});
