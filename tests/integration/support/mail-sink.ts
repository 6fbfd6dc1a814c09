import { expect } from "vitest";
import { findLinks, listCaughtMessages, type CaughtMessage } from "@/lib/mail/sink";

// Reads what the real SMTP sink caught. Tests use a fresh address each, so they never need to
// clear the sink and never see each other's mail.

export async function waitForMessage(params: { to: string; subject?: RegExp; timeoutMs?: number }): Promise<CaughtMessage> {
  const deadline = Date.now() + (params.timeoutMs ?? 10_000);
  for (;;) {
    const messages = await listCaughtMessages({ to: params.to });
    const match = messages.find((message) => !params.subject || params.subject.test(message.subject));
    if (match) return match;
    if (Date.now() > deadline) throw new Error(`No e-mail to ${params.to} reached the mail sink in time.`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

export async function countMessagesTo(to: string): Promise<number> {
  return (await listCaughtMessages({ to })).length;
}

/** The token at the end of the one link in the message that points at `pathPrefix`. */
export function tokenFromLink(message: CaughtMessage, pathPrefix: string): string {
  const links = findLinks(message.text).filter((link) => new URL(link).pathname.startsWith(pathPrefix));
  expect(links).toHaveLength(1);
  const token = new URL(links[0]!).pathname.slice(pathPrefix.length);
  expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
  return token;
}
