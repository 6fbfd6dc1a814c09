/**
 * The local mail sink keeps what it caught across a restart (as `npm start` run twice must lose
 * nothing, invitation links included), numbers on from where it stopped, and empties its file
 * when told to. Its message list holds sign-in links, so it answers only requests bearing its token.
 */
import { mkdtemp, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freePort, startPrivateMailSink, type PrivateMailSink } from "./enrolment-fixtures";

type Caught = { id: number; to: string; subject: string; text: string };

let folder: string;
let smtpPort: number;
let sink: PrivateMailSink | undefined;

beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), "edgewise-mail-sink-"));
  smtpPort = await freePort();
});

afterAll(async () => {
  sink?.process.kill();
  await rm(folder, { recursive: true, force: true });
});

async function send(to: string, subject: string, headers: Record<string, string> = {}): Promise<void> {
  const transport = nodemailer.createTransport({ host: "127.0.0.1", port: smtpPort, secure: false, ignoreTLS: true });
  await transport.sendMail({ from: "sink-test@edgewise.example.test", to, subject, headers, text: `Link: http://127.0.0.1/invitations/${subject}` });
  transport.close();
}

async function caught(): Promise<Caught[]> {
  return (await fetch(sink!.listUrl, { headers: sink!.headers })).json();
}

async function restart(file: string): Promise<void> {
  const exited = new Promise((resolve) => sink!.process.once("exit", resolve));
  sink!.process.kill("SIGTERM");
  await exited;
  sink = await startPrivateMailSink(smtpPort, file);
}

describe("the local mail sink", () => {
  it("keeps every message across a restart and numbers on from the last", async () => {
    const file = path.join(folder, "mail.jsonl");
    sink = await startPrivateMailSink(smtpPort, file);
    await send("first.learner@sink.example", "token-one");
    await send("second.learner@sink.example", "token-two");
    expect((await caught()).map((m) => m.subject)).toEqual(["token-two", "token-one"]);

    await restart(file);
    const kept = await caught();
    expect(kept.map((m) => [m.id, m.subject])).toEqual([
      [2, "token-two"],
      [1, "token-one"],
    ]);
    expect(kept[1].text).toContain("/invitations/token-one");

    await send("third.learner@sink.example", "token-three");
    expect((await caught())[0]).toMatchObject({ id: 3, subject: "token-three", to: "third.learner@sink.example" });
  });

  it("forgets everything, on disk too, when its list is deleted", async () => {
    const file = path.join(folder, "emptied.jsonl");
    await restart(file);
    await send("someone@sink.example", "token-four");
    expect((await fetch(sink!.listUrl, { method: "DELETE", headers: sink!.headers })).status).toBe(204);
    expect(await caught()).toEqual([]);
    expect(await readFile(file, "utf8")).toBe("");
    await restart(file);
    expect(await caught()).toEqual([]);
  });

  it("refuses its message list to a request without its token, and lets nothing be deleted", async () => {
    await restart(path.join(folder, "guarded.jsonl"));
    await send("guarded@sink.example", "token-five");
    for (const authorization of [undefined, "Bearer not-the-token-of-this-sink", `Basic ${btoa(sink!.headers.authorization!)}`]) {
      const headers = authorization ? { authorization } : undefined;
      const listed = await fetch(sink!.listUrl, { headers });
      expect(listed.status, authorization ?? "no token").toBe(401);
      expect(await listed.text()).not.toContain("token-five");
      expect((await fetch(sink!.listUrl, { method: "DELETE", headers })).status).toBe(401);
    }
    expect((await caught()).map((m) => m.subject)).toEqual(["token-five"]);
  });

  it("keeps the school a message was sent for and its recipients' addresses, and lists one school's mail", async () => {
    await restart(path.join(folder, "schools.jsonl"));
    await send("Ada Reyes <Ada.Reyes@sink.example>", "token-six", { "X-Edgewise-School": "school-one" });
    await send("bo@sink.example", "token-seven", { "X-Edgewise-School": "school-two" });
    await send("cy@sink.example", "token-eight");
    expect(await caught()).toMatchObject([
      { subject: "token-eight", school: "", recipients: ["cy@sink.example"] },
      { subject: "token-seven", school: "school-two", recipients: ["bo@sink.example"] },
      { subject: "token-six", school: "school-one", recipients: ["ada.reyes@sink.example"] },
    ]);
    const schoolOne = (await (await fetch(`${sink!.listUrl}?school=school-one`, { headers: sink!.headers })).json()) as Caught[];
    expect(schoolOne.map((m) => m.subject)).toEqual(["token-six"]);
  });
});
