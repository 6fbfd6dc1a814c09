import { describe, expect, it, vi } from "vitest";
import { describeError } from "@/lib/http/errors";

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
