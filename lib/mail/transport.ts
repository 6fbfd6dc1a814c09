import nodemailer, { type Transporter } from "nodemailer";
import { readMailEnv } from "@/lib/env";
import type { ComposedMail } from "./compose";

let transporter: Transporter | undefined;

export function getTransport(): Transporter {
  if (transporter) return transporter;
  const env = readMailEnv();
  transporter = nodemailer.createTransport({
    // A batch of invitations reuses a few connections instead of opening one per message.
    pool: true,
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    // Without implicit TLS a provider still offers STARTTLS; the local sink does not, so plain is allowed there only.
    ignoreTLS: !env.SMTP_SECURE && isLoopback(env.SMTP_HOST),
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" } : undefined,
  });
  return transporter;
}

/**
 * Names the school a message is sent for. The local mail sink keeps it, and its caught-mail page
 * shows a school's admin only their own school's mail (lib/mail/sink.ts).
 */
export const schoolHeader = "X-Edgewise-School";

/** Sends one composed message to one person, on behalf of their school. */
export async function deliverMail(params: { schoolId: string; to: string; mail: ComposedMail }): Promise<void> {
  await getTransport().sendMail({
    from: readMailEnv().MAIL_FROM,
    to: params.to,
    headers: { [schoolHeader]: params.schoolId },
    ...params.mail,
  });
}

function isLoopback(host: string): boolean {
  return host === "localhost" || host === "::1" || host.startsWith("127.");
}
