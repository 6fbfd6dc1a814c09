import { z } from "zod";
import { findAddressesKnownToSchool } from "@/db/queries/schools";
import { readMailSinkEnv } from "@/lib/env";

// Reads the local development/test SMTP sink (scripts/mail-sink.mjs). Not used in production.

const caughtMessageSchema = z.object({
  id: z.number(),
  from: z.string(),
  to: z.string(),
  // Messages caught before the sink kept these have neither, and so belong to no school.
  recipients: z.array(z.string()).default([]),
  school: z.string().default(""),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  date: z.string(),
});
export type CaughtMessage = z.infer<typeof caughtMessageSchema>;

export function isMailSinkEnabled(): boolean {
  return readMailSinkEnv() !== undefined;
}

/** Newest first; `to` keeps messages whose recipients contain it, `school` those sent for that school. */
export async function listCaughtMessages(params: { to?: string; school?: string } = {}): Promise<CaughtMessage[]> {
  const sink = readMailSinkEnv();
  if (!sink) return [];
  const url = new URL(`${sink.url}/messages`);
  if (params.to) url.searchParams.set("to", params.to);
  if (params.school) url.searchParams.set("school", params.school);
  const response = await fetch(url, { cache: "no-store", headers: { authorization: `Bearer ${sink.token}` } });
  if (!response.ok) throw new Error(`The mail sink answered ${response.status}.`);
  return z.array(caughtMessageSchema).parse(await response.json());
}

/**
 * The caught mail a school's admin may read: sent for their school (the header the app stamps on
 * every message, lib/mail/transport.ts) and addressed only to people the school knows, its own
 * accounts or addresses it invited. Neither test is enough alone: one address can be known to two
 * schools (invited by one, with an account at the other), and its mail from the other school, a
 * password-reset link say, must stay there.
 */
export async function listSchoolCaughtMessages(params: { schoolId: string }): Promise<CaughtMessage[]> {
  const messages = await listCaughtMessages({ school: params.schoolId });
  const known = await findAddressesKnownToSchool({
    schoolId: params.schoolId,
    emails: [...new Set(messages.flatMap((message) => message.recipients))],
  });
  return messages.filter((message) => message.recipients.length > 0 && message.recipients.every((address) => known.has(address)));
}

const linkPattern = /https?:\/\/[^\s<>"']+/g;

export function findLinks(text: string): string[] {
  return [...new Set(text.match(linkPattern) ?? [])];
}
