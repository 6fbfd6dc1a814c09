import { NextResponse } from "next/server";
import { describeError } from "./errors";

export function errorResponse(error: unknown): NextResponse {
  const { status, body } = describeError(error);
  return NextResponse.json(body, { status });
}
