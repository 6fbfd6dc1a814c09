import ipaddr from "ipaddr.js";
import { z } from "zod";

// Each part of the app reads only the settings it needs, on first use, so a script that only
// migrates does not demand mail settings and `next build` does not need a database.

const databaseEnvSchema = z.object({
  DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/, error: "must be a postgres:// URL" }),
});

const appEnvSchema = z.object({
  APP_URL: z.url({ protocol: /^https?$/, error: "must be an http:// or https:// origin" }),
});

const booleanFlag = z
  .enum(["true", "false", "1", "0", ""])
  .default("false")
  .transform((value) => value === "true" || value === "1");

const mailEnvSchema = z.object({
  SMTP_HOST: z.string().min(1, "must name the SMTP server"),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535),
  SMTP_SECURE: booleanFlag,
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3, "must be a sender such as Edgewise <no-reply@school.example>"),
});

const emptyAsUnset = (value: unknown) => (value === "" ? undefined : value);

// The local sink's message API answers only requests bearing its token (scripts/mail-sink.mjs).
const mailSinkEnvSchema = z
  .object({
    MAIL_SINK_URL: z.preprocess(emptyAsUnset, z.url().optional()),
    MAIL_SINK_TOKEN: z.preprocess(emptyAsUnset, z.string().min(16, "must be the mail sink's token (16 characters or more)").optional()),
  })
  .refine((env) => !env.MAIL_SINK_URL || env.MAIL_SINK_TOKEN, { path: ["MAIL_SINK_TOKEN"], error: "must be set with MAIL_SINK_URL" });

// How soon an invitation e-mail that did not go out is tried again; each failed try doubles the
// wait, up to 30 times this.
const mailRetryEnvSchema = z.object({
  INVITATION_MAIL_RETRY_SECONDS: z.coerce.number().positive().max(3_600).default(60),
});

// The proxies whose X-Forwarded-For entries are believed (lib/client-address): addresses, CIDR
// ranges, or the names proxy-addr knows for the loopback, link-local and unique-local ranges.
const proxyNames = new Set(["loopback", "linklocal", "uniquelocal"]);
const isProxyEntry = (entry: string) => proxyNames.has(entry) || ipaddr.isValid(entry) || ipaddr.isValidCIDR(entry);
const trustedProxiesEnvSchema = z.object({
  TRUSTED_PROXIES: z
    .string()
    .default("")
    .transform((value) => value.split(",").map((entry) => entry.trim()).filter((entry) => entry !== ""))
    .refine((entries) => entries.every(isProxyEntry), {
      error: "must list IP addresses or CIDR ranges (such as 10.0.0.0/8), separated by commas",
    }),
});

export type DatabaseEnv = z.infer<typeof databaseEnvSchema>;
export type AppEnv = z.infer<typeof appEnvSchema>;
export type MailEnv = z.infer<typeof mailEnvSchema>;

export class EnvError extends Error {
  override name = "EnvError";
}

function readEnv<T extends z.ZodType>(schema: T): z.infer<T> {
  const result = schema.safeParse(process.env);
  if (result.success) return result.data;
  const problems = result.error.issues.map((issue) => {
    const key = issue.path.join(".");
    return process.env[key] ? `${key} ${issue.message}` : `${key} is not set`;
  });
  throw new EnvError(`Configuration problem: ${problems.join("; ")}.`);
}

function once<T>(read: () => T): () => T {
  let value: { current: T } | undefined;
  return () => (value ??= { current: read() }).current;
}

export const readDatabaseEnv = once(() => readEnv(databaseEnvSchema));
export const readAppEnv = once(() => {
  const env = readEnv(appEnvSchema);
  return { ...env, APP_URL: env.APP_URL.replace(/\/+$/, "") };
});
export const readMailEnv = once(() => readEnv(mailEnvSchema));
/** The local mail sink's API, when the scripts started one. */
export const readMailSinkEnv = once((): { url: string; token: string } | undefined => {
  const env = readEnv(mailSinkEnvSchema);
  return env.MAIL_SINK_URL && env.MAIL_SINK_TOKEN ? { url: env.MAIL_SINK_URL.replace(/\/+$/, ""), token: env.MAIL_SINK_TOKEN } : undefined;
});
export const readTrustedProxies = once(() => readEnv(trustedProxiesEnvSchema).TRUSTED_PROXIES);
export const readMailRetryEnv = once(() => readEnv(mailRetryEnvSchema));
