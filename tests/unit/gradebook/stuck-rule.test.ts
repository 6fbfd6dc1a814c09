import { describe, expect, it } from "vitest";
import { findIdleReason, isStuckOnLab, stuckRule } from "@/lib/gradebook";

const day = 86_400_000;
const now = new Date("2026-03-10T12:00:00Z");

describe("stuck on a lab", () => {
  it("takes five failed attempts without a pass", () => {
    expect(stuckRule.failedAttempts).toBe(5);
    expect(isStuckOnLab({ passed: false, failedAttempts: 4 })).toBe(false);
    expect(isStuckOnLab({ passed: false, failedAttempts: 5 })).toBe(true);
    expect(isStuckOnLab({ passed: false, failedAttempts: 9 })).toBe(true);
  });

  it("never holds once the lab is passed, however many attempts failed before", () => {
    expect(isStuckOnLab({ passed: true, failedAttempts: 12 })).toBe(false);
  });
});

describe("idle for a week", () => {
  const base = { enrolledAt: new Date("2026-01-05T00:00:00Z"), cohortStartsOn: "2026-01-12", now };

  it("counts whole days since the last activity, flagging from the seventh", () => {
    expect(findIdleReason({ ...base, lastActivityAt: new Date(now.getTime() - 7 * day + 1000) })).toBeNull();
    const last = new Date(now.getTime() - 7 * day);
    expect(findIdleReason({ ...base, lastActivityAt: last })).toEqual({ idleDays: 7, lastActivityAt: last });
    expect(findIdleReason({ ...base, lastActivityAt: new Date(now.getTime() - 20.5 * day) })?.idleDays).toBe(20);
  });

  it("without any activity, counts from the later of joining and the cohort's start", () => {
    const joinedLate = { ...base, enrolledAt: new Date(now.getTime() - 3 * day), lastActivityAt: null };
    expect(findIdleReason(joinedLate)).toBeNull();
    const joinedEarly = { ...base, lastActivityAt: null };
    // The cohort opened on 12 Jan, 57 days and 12 hours before `now`.
    expect(findIdleReason(joinedEarly)).toEqual({ idleDays: 57, lastActivityAt: null });
  });

  it("flags nobody before the cohort starts", () => {
    expect(findIdleReason({ ...base, cohortStartsOn: "2026-04-01", lastActivityAt: null })).toBeNull();
  });
});
