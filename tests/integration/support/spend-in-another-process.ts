// Spends rate-limit points from a process of its own, with its own connection pool, against the
// same database: `tsx --conditions=react-server spend-in-another-process.ts <action> <per> <key> <count>`.
// Says "ready" once connected, spends when a line arrives on standard input, all at once, and
// prints how many of the spends were allowed.
import { once } from "node:events";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import type { LimitedAction, LimitSubject } from "@/lib/rate-limit/limits";
import { spendRateLimits } from "@/lib/rate-limit/rate-limiter";

const [action, per, key, count] = process.argv.slice(2) as [LimitedAction, LimitSubject, string, string];
await Promise.all(Array.from({ length: 10 }, () => db.execute(sql`select 1`)));
console.log("ready");
await once(process.stdin, "data");
const decisions = await Promise.all(Array.from({ length: Number(count) }, () => spendRateLimits(action, { [per]: key })));
console.log(JSON.stringify({ allowed: decisions.filter((decision) => decision.allowed).length }));
process.exit(0);
