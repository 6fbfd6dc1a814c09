import { NextResponse } from "next/server";
import { describeError } from "./errors";

export function errorResponse(error: unknown): NextResponse {
  const { status, body, headers } = describeError(error);
  return NextResponse.json(body, { status, headers });
}

/** Runs a route handler's work and answers whatever it throws (a database outage, say) as a JSON error. */
export async function respondSafely(work: () => Promise<Response>): Promise<Response> {
  try {
    return await work();
  } catch (error) {
    return errorResponse(error);
  }
}
