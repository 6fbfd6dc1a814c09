import { z } from "zod";
import { EnvError } from "@/lib/env";

// The upload service is configured by the SDK's own UPLOADTHING_* variables; the app reads only
// what it needs to fetch stored files back: the API key, and whether the service is the local
// stand-in the scripts start (they set UPLOADTHING_INGEST_URL only for it).

const tokenSchema = z.object({
  apiKey: z.string().startsWith("sk_"),
  appId: z.string().min(1),
  regions: z.array(z.string()).min(1),
});

const uploadEnvSchema = z.object({
  UPLOADTHING_TOKEN: z.string().min(1),
  UPLOADTHING_INGEST_URL: z.preprocess((value) => (value === "" ? undefined : value), z.url().optional()),
});

export type UploadSettings = { apiKey: string; localServiceUrl: string | null };

function decodeToken(token: string): z.infer<typeof tokenSchema> | null {
  try {
    const parsed = tokenSchema.safeParse(JSON.parse(Buffer.from(token, "base64").toString("utf8")));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}

/** Read on every call: cheap, and it follows the environment a test sets for its own upload service. */
export function readUploadSettings(): UploadSettings {
  const env = uploadEnvSchema.safeParse(process.env);
  if (!env.success) throw new EnvError("Configuration problem: UPLOADTHING_TOKEN is not set.");
  const token = decodeToken(env.data.UPLOADTHING_TOKEN);
  if (!token) {
    throw new EnvError('Configuration problem: UPLOADTHING_TOKEN must be base64 of JSON {"apiKey":"sk_…","appId":"…","regions":["…"]}.');
  }
  return { apiKey: token.apiKey, localServiceUrl: env.data.UPLOADTHING_INGEST_URL?.replace(/\/+$/, "") ?? null };
}
