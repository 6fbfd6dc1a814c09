import { spawn, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import net from "node:net";
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { cohortMemberships, cohorts, invitations, schools, users, type Role } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { Actor } from "@/lib/enrolment";

// A school of its own for each enrolment test, so counts are exact and the seeded demo school
// (which the browser tests read) is never changed. Every name is invented.

export type TestSchool = { schoolId: string; admin: Actor; cohortId: string; cohortName: string; domain: string };

let hashed: Promise<string> | undefined;
export const staffPassword = "signal bench ground clip";

export async function createSchoolAccount(params: { schoolId: string; role: Role; name: string; email: string }) {
  hashed ??= hashPassword(staffPassword);
  const [user] = await db
    .insert(users)
    .values({ ...params, passwordHash: await hashed })
    .returning({ id: users.id, name: users.name, email: users.email });
  return user!;
}

export async function createTestSchool(label: string): Promise<TestSchool> {
  const tag = randomUUID().slice(0, 8);
  const domain = `${label}-${tag}.example`;
  const [school] = await db
    .insert(schools)
    .values({ slug: `${label}-${tag}`, name: `Wrenfield ${label} institute ${tag}` })
    .returning({ id: schools.id });
  const admin = await createSchoolAccount({ schoolId: school!.id, role: "admin", name: "Orla Fenwick", email: `admin@${domain}` });
  const cohortName = "Pixel runs — spring";
  const [cohort] = await db
    .insert(cohorts)
    .values({ schoolId: school!.id, name: cohortName, courseSlug: "data-runs", startsOn: "2026-03-02", endsOn: "2026-06-26" })
    .returning({ id: cohorts.id });
  return { schoolId: school!.id, admin: { id: admin.id, schoolId: school!.id, name: admin.name }, cohortId: cohort!.id, cohortName, domain };
}

export function csvFile(text: string, name = "roster.csv"): File {
  return new File([text], name, { type: "text/csv" });
}

export function rosterCsv(rows: { name: string; email: string }[], separator = ","): string {
  return ["name" + separator + "email", ...rows.map((row) => `${row.name}${separator}${row.email}`)].join("\n") + "\n";
}

export async function countSchoolRows(params: { schoolId: string; cohortId: string; emails: string[] }) {
  const found = params.emails.length === 0 ? [] : await db.select({ id: users.id }).from(users).where(inArray(users.email, params.emails));
  const memberships = await db.select({ userId: cohortMemberships.userId }).from(cohortMemberships).where(eq(cohortMemberships.cohortId, params.cohortId));
  const issued = await db.select({ id: invitations.id }).from(invitations).where(eq(invitations.schoolId, params.schoolId));
  return { users: found.length, memberships: memberships.length, invitations: issued.length };
}

export async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

async function waitForPort(port: number): Promise<void> {
  const deadline = Date.now() + 15_000;
  while (Date.now() < deadline) {
    const open = await new Promise<boolean>((resolve) => {
      const socket = net.connect(port, "127.0.0.1", () => {
        socket.end();
        resolve(true);
      });
      socket.on("error", () => resolve(false));
    });
    if (open) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`Nothing listened on 127.0.0.1:${port} in time.`);
}

/** `headers` carry the sink's token, which its message list demands. */
export type PrivateMailSink = { process: ChildProcess; listUrl: string; headers: Record<string, string> };

/**
 * The project's real sink script on ports of this file's own, for tests that must stop mail or
 * send thousands of letters without filling the shared sink other tests and pages read;
 * `keptIn` names the file it keeps its messages in (memory only when empty).
 */
export async function startPrivateMailSink(smtpPort: number, keptIn = ""): Promise<PrivateMailSink> {
  const apiPort = await freePort();
  const token = randomUUID();
  const child = spawn(process.execPath, ["scripts/mail-sink.mjs"], {
    // In memory unless a file is named: the shared sink's file is never this one's.
    env: { ...process.env, SMTP_PORT: String(smtpPort), MAIL_SINK_API_PORT: String(apiPort), MAIL_SINK_FILE: keptIn, MAIL_SINK_TOKEN: token },
    stdio: "ignore",
  });
  await waitForPort(smtpPort);
  await waitForPort(apiPort);
  return { process: child, listUrl: `http://127.0.0.1:${apiPort}/messages`, headers: { authorization: `Bearer ${token}` } };
}
