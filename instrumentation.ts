// Runs once when a server process starts (Next's instrumentation hook).
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  // First, so that as few requests as possible arrive before their peer address is stamped.
  const { startStampingPeerAddresses } = await import("@/lib/client-address/peer-address");
  startStampingPeerAddresses();
  // A TRUSTED_PROXIES that does not parse is reported here as the server starts (Next then answers
  // every request with 500) rather than only when a rate-limited request first needs it.
  const { readTrustedProxies } = await import("@/lib/env");
  readTrustedProxies();
  const { startInvitationMailRetries } = await import("@/lib/enrolment/invitation-mail-retry");
  startInvitationMailRetries();
}
