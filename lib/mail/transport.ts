import nodemailer, { type Transporter } from "nodemailer";
import { readMailEnv } from "@/lib/env";

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

export function mailSender(): string {
  return readMailEnv().MAIL_FROM;
}

function isLoopback(host: string): boolean {
  return host === "localhost" || host === "::1" || host.startsWith("127.");
}
