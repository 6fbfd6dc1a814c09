// Runs once when a server process starts (Next's instrumentation hook).
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  // First, so that as few requests as possible arrive before their peer address is stamped.
  const { startStampingPeerAddresses } = await import("@/lib/client-address/peer-address");
  startStampingPeerAddresses();
  const { startInvitationMailRetries } = await import("@/lib/enrolment/invitation-mail-retry");
  startInvitationMailRetries();
}
