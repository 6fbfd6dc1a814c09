import { sql } from "drizzle-orm";
import { NextResponse } from "next/server";
import { db } from "@/db/client";
import { AppError } from "@/lib/http/errors";
import { errorResponse } from "@/lib/http/respond";

export const dynamic = "force-dynamic";

/** For load balancers and the start script: 200 when the app can reach its database. */
export async function GET(): Promise<NextResponse> {
  try {
    await db.execute(sql`select 1`);
    return NextResponse.json({ ok: true });
  } catch (error) {
    console.error("Health check: database unreachable", error);
    return errorResponse(new AppError("unavailable", "The database is not reachable."));
  }
}
