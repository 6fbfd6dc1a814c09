import "server-only";
import { headers } from "next/headers";

/**
 * The address used for sign-in throttling. Behind a load balancer the first X-Forwarded-For hop
 * is the client; a direct caller can forge it, which is why accounts are throttled on their own too.
 */
export async function readClientAddress(): Promise<string> {
  const list = await headers();
  const forwarded = list.get("x-forwarded-for")?.split(",")[0]?.trim();
  return forwarded || list.get("x-real-ip")?.trim() || "unknown";
}
