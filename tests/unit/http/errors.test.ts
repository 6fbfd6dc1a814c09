import { describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { invalidInput } from "@/lib/grading/input-error";
import { AppError, describeError, errorReplyLimits } from "@/lib/http/errors";

// How failures of the database client become statuses: an outage is 503 (try again shortly),
// anything else unexpected is 500, and neither carries the original message to the client.

function withCode(message: string, code?: string): Error {
  return Object.assign(new Error(message), code ? { code } : {});
}

describe("describeError", () => {
  vi.spyOn(console, "error").mockImplementation(() => {});

  it.each([
    ["connection refused", withCode("connect ECONNREFUSED 127.0.0.1:5432", "ECONNREFUSED")],
    ["server shutting down", withCode("terminating connection due to administrator command", "57P01")],
    ["statement timeout", withCode("canceling statement due to statement timeout", "57014")],
    ["no connection in time", withCode("timeout exceeded when trying to connect")],
    ["server gone mid-query", withCode("Connection terminated unexpectedly")],
    ["no answer to a query", withCode("Query read timeout")],
    ["wrapped by the query builder", new Error("Failed query: select 1", { cause: withCode("Connection terminated unexpectedly") })],
  ])("answers 503 for %s", (_, error) => {
    const { status, body } = describeError(error);
    expect(status).toBe(503);
    expect(body.error.code).toBe("unavailable");
    expect(body.error.message).not.toContain(error.message);
  });

  it("answers 500 for a failure that is not an outage", () => {
    expect(describeError(withCode('duplicate key value violates unique constraint "users_email_unique"', "23505")).status).toBe(500);
    expect(describeError(new Error("timeout expired somewhere else")).status).toBe(500);
  });
});

describe("an error reply", () => {
  it("names five bad fields of ten thousand and counts the rest, so it stays small", () => {
    const keys = Array.from({ length: 10_000 }, (_, i) => `unexpected-${i}-${"k".repeat(500)}`);
    const { status, body } = describeError(invalidInput(keys.map((path) => ({ path, message: "is not expected here" }))));
    expect(status).toBe(422);
    expect(Object.keys(body.error.fieldErrors!)).toHaveLength(errorReplyLimits.fields);
    expect(body.error.moreFieldErrors).toBe(9_995);
    expect(body.error.message).toMatch(/^unexpected-0-k+…? \(and 9995 more fields\)\.$/);
    for (const name of Object.keys(body.error.fieldErrors!)) expect(name.length).toBeLessThanOrEqual(errorReplyLimits.nameLength);
    expect(JSON.stringify(body).length).toBeLessThan(2_000);
  });

  it("bounds a schema's errors too, and keeps a field named __proto__ a plain key", () => {
    const names = Array.from({ length: 50 }, (_, i) => `field${i}`);
    const schema = z.object(Object.fromEntries(names.map((name) => [name, z.string()])));
    const { body } = describeError(schema.safeParse(Object.fromEntries(names.map((name) => [name, 1]))).error);
    expect(Object.keys(body.error.fieldErrors!)).toEqual(names.slice(0, errorReplyLimits.fields));
    expect(body.error.moreFieldErrors).toBe(45);
    const { body: polluting } = describeError(invalidInput([{ path: "__proto__", message: "is not expected here" }]));
    const sent = JSON.parse(JSON.stringify(polluting)) as { error: { fieldErrors: object } };
    expect(Object.hasOwn(sent.error.fieldErrors, "__proto__")).toBe(true);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it("keeps every field when there are five or fewer, and clips a long message", () => {
    const { body } = describeError(new AppError("invalid-input", "x".repeat(5_000), { a: ["one"], b: ["two", "three", "four", "five"] }));
    expect(body.error.fieldErrors).toEqual({ a: ["one"], b: ["two", "three", "four"] });
    expect(body.error.moreFieldErrors).toBeUndefined();
    expect(body.error.message.length).toBe(errorReplyLimits.messageLength);
  });
});
