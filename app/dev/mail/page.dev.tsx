import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatMoment } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { findLinks, isMailSinkEnabled, listSchoolCaughtMessages, type CaughtMessage } from "@/lib/mail/sink";

export const metadata: Metadata = { title: "Caught mail", robots: { index: false } };

// Built only by the project's scripts (see next.config.ts), and answers only while the local mail
// sink is configured; with real SMTP there is nothing to show, so the route is absent. An admin
// sees their own school's mail only: other schools' links (password resets) would hand out accounts.
export default async function CaughtMailPage() {
  if (!isMailSinkEnabled()) notFound();
  const user = await requireRouteAccess("/dev/mail");
  const messages = await listSchoolCaughtMessages({ schoolId: user.schoolId }).catch(() => null);

  return (
    <AppFrame user={user}>
      <PageHeading
        eyebrow="Development only"
        title="Caught mail"
        lead="Every message the app sent to people of your school through the local mail sink, newest first. Nothing here reached a real inbox."
      />
      {messages === null ? (
        <Card>
          <p className="text-danger">The mail sink is not answering. Start it, then reload this page.</p>
        </Card>
      ) : messages.length === 0 ? (
        <Card>
          <p className="text-ink-soft">No messages yet. Send an invitation or ask for a password reset.</p>
        </Card>
      ) : (
        <ul className="space-y-4">
          {messages.map((message) => (
            <li key={message.id}>
              <MessageCard message={message} />
            </li>
          ))}
        </ul>
      )}
    </AppFrame>
  );
}

function MessageCard({ message }: { message: CaughtMessage }) {
  const links = findLinks(message.text);
  return (
    <Card>
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h2 className="text-lg font-semibold">{message.subject}</h2>
        <p className="text-sm text-ink-faint">{formatMoment(new Date(message.date))}</p>
      </div>
      <p className="mt-1 text-sm text-ink-soft break-all">To: {message.to}</p>
      {links.length > 0 ? (
        <ul className="mt-3 space-y-1">
          {links.map((link) => (
            <li key={link}>
              <a href={link} className="text-sm font-medium text-accent underline underline-offset-2 break-all">
                {link}
              </a>
            </li>
          ))}
        </ul>
      ) : null}
      <details className="mt-3">
        <summary className="cursor-pointer text-sm text-ink-soft">Show the message text</summary>
        <pre className="mt-2 overflow-x-auto rounded-lg bg-sunken p-3 text-sm whitespace-pre-wrap">{message.text}</pre>
      </details>
    </Card>
  );
}
