import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { z } from "zod";
import { AppFrame } from "@/components/shell/app-frame";
import { buttonClass } from "@/components/ui/button-class";
import { getCurrentUser } from "@/lib/auth/current-user";
import { parseCertificateCode } from "@/lib/certificates/code";
import { verificationPath } from "@/lib/certificates/urls";

export const metadata: Metadata = { title: "Check a certificate" };

const searchSchema = z.object({ code: z.string().max(200).optional().catch(undefined) });

/** A plain GET form, so it works without JavaScript; a well-formed code goes on to its own page. */
export default async function VerifyPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { code: typed } = searchSchema.parse(await searchParams);
  const code = typed === undefined ? null : parseCertificateCode(typed);
  if (code) redirect(verificationPath(code));
  const error = typed !== undefined ? "That is not a certificate code: it has sixteen letters and digits, such as 7K2M-QX9P-4TDW-8HBN." : null;
  const user = await getCurrentUser();

  return (
    <AppFrame user={user}>
      <section className="mx-auto max-w-xl">
        <p className="text-sm font-semibold uppercase tracking-wide text-copper">Certificate check</p>
        <h1 className="mt-1 text-3xl font-semibold tracking-tight sm:text-4xl">Check an Edgewise certificate</h1>
        <p className="mt-3 text-ink-soft">
          Type the verification code printed on the certificate, or scan its QR code. You will see who it was awarded
          to, for which course, by which school, and whether it still stands.
        </p>
        <form method="get" action="/verify" className="mt-8 space-y-4 rounded-card border border-line bg-surface p-5 sm:p-6">
          <div className="space-y-1.5">
            <label htmlFor="certificate-code" className="block text-sm font-medium text-ink">
              Verification code
            </label>
            <input
              id="certificate-code"
              name="code"
              type="text"
              required
              maxLength={40}
              autoComplete="off"
              spellCheck={false}
              placeholder="XXXX-XXXX-XXXX-XXXX"
              defaultValue={typed}
              aria-invalid={error ? true : undefined}
              aria-describedby={error ? "certificate-code-error" : undefined}
              className={`block w-full rounded-lg border bg-surface px-3 py-2.5 font-mono text-lg tracking-wider text-ink uppercase outline-none placeholder:text-ink-faint focus:border-accent focus:ring-2 focus:ring-accent/25 ${
                error ? "border-danger" : "border-line-strong"
              }`}
            />
            <div aria-live="polite">
              {error ? (
                <p id="certificate-code-error" className="text-sm font-medium text-danger">
                  {error}
                </p>
              ) : null}
            </div>
          </div>
          <button type="submit" className={buttonClass("primary")}>
            Check the certificate
          </button>
        </form>
      </section>
    </AppFrame>
  );
}
