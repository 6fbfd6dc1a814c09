// Runs once when a server process starts (Next's instrumentation hook).
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startInvitationMailRetries } = await import("@/lib/enrolment/invitation-mail-retry");
  startInvitationMailRetries();
}
