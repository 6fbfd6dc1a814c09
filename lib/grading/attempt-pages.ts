import { z } from "zod";

// The learner's attempt list comes a page at a time, newest first: `limit` attempts (20 unless
// asked, at most 100), and `cursor` from the previous page's `nextCursor` for the ones before it.
// The cursor is the number of the last attempt shown; attempts are only ever added with higher
// numbers, so a page never repeats or skips one while the learner keeps submitting.

export const attemptPageSizes = { default: 20, max: 100 } as const;

const limitError = { error: `must be a whole number from 1 to ${attemptPageSizes.max}` };

export const attemptPageQuerySchema = z.object({
  limit: z.coerce.number(limitError).int(limitError).min(1, limitError).max(attemptPageSizes.max, limitError).default(attemptPageSizes.default),
  cursor: z
    .string()
    .regex(/^[1-9][0-9]{0,8}$/, { error: "must be the nextCursor of an earlier page" })
    .transform(Number)
    .optional(),
});

export type AttemptPageQuery = z.infer<typeof attemptPageQuerySchema>;

/** The search parameters as the schema reads them; a parameter given twice is read once. */
export function readAttemptPageQuery(url: string): AttemptPageQuery {
  const params = new URL(url).searchParams;
  return attemptPageQuerySchema.parse({ limit: params.get("limit") ?? undefined, cursor: params.get("cursor") ?? undefined });
}

/** The page from `limit + 1` rows read: the extra row only says that there is a next page. */
export function toAttemptPage<T extends { attemptNumber: number }>(rows: T[], limit: number): { items: T[]; nextCursor: string | null } {
  const items = rows.slice(0, limit);
  const last = items.at(-1);
  return { items, nextCursor: rows.length > limit && last ? String(last.attemptNumber) : null };
}
