import { z } from "zod";
import { readMailSinkUrl } from "@/lib/env";

// Reads the local development/test SMTP sink (scripts/mail-sink.mjs). Not used in production.

const caughtMessageSchema = z.object({
  id: z.number(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  date: z.string(),
});
export type CaughtMessage = z.infer<typeof caughtMessageSchema>;

export function isMailSinkEnabled(): boolean {
  return readMailSinkUrl() !== undefined;
}

/** Newest first. */
export async function listCaughtMessages(params: { to?: string } = {}): Promise<CaughtMessage[]> {
  const base = readMailSinkUrl();
  if (!base) return [];
  const url = new URL(`${base}/messages`);
  if (params.to) url.searchParams.set("to", params.to);
  const response = await fetch(url, { cache: "no-store" });
  if (!response.ok) throw new Error(`The mail sink answered ${response.status}.`);
  return z.array(caughtMessageSchema).parse(await response.json());
}

const linkPattern = /https?:\/\/[^\s<>"']+/g;

export function findLinks(text: string): string[] {
  return [...new Set(text.match(linkPattern) ?? [])];
}
