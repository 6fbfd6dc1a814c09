/**
 * Server actions refuse requests sent from another site (cross-site request forgery): a POST with
 * the action's header and a valid body, sent as a persona allowed to run it, but with an Origin
 * that is not the app's. Next aborts such a call with a 500; proxy.ts answers 403 before it.
 */
import { describe, expect, it } from "vitest";
import { expectNoInternals } from "../support/hostile-input";
import { actionForms, planActionCall, type ActionForm } from "./support/action-forms";
import { setUpAccessWorld, type AccessWorld } from "./support/access-world";
import { builtActionId } from "./support/app-surface";
import { baseUrl } from "./support/browser";
import { changedTables, readDatabaseState } from "./support/database-state";
import { callAction } from "./support/server-actions";

let world: AccessWorld;
setUpAccessWorld((built) => (world = built));

async function sendFrom(origin: string, key: string, form: ActionForm) {
  const plan = await planActionCall(form, world, form.allowed, world.people[form.allowed].cookie);
  const before = await readDatabaseState();
  const reply = await callAction({ ...plan, actionId: builtActionId(key), origin });
  return { reply, changed: changedTables(before, await readDatabaseState()) };
}

describe("server actions sent from another site", () => {
  for (const origin of ["http://elsewhere.example", "null", `${new URL(baseUrl).protocol}//${new URL(baseUrl).hostname}:1`]) {
    it(`refuses every action with Origin ${origin.replace(/:\d+$/, ":<another port>")}: 403, a plain sentence, nothing written`, async () => {
      for (const [key, form] of Object.entries(actionForms)) {
        const { reply, changed } = await sendFrom(origin, key, form);
        expect({ key, status: reply.status, changed }).toEqual({ key, status: 403, changed: [] });
        expect(reply.body).toContain("sent from another site");
        expectNoInternals(reply.body, key);
      }
    });
  }

  it("refuses a cross-site post of the no-script form encoding too", async () => {
    const [key, form] = Object.entries(actionForms).find(([, candidate]) => candidate.allowed === "admin")!;
    const fields = await form.fields!(world, "admin");
    const body = new FormData();
    body.append(`$ACTION_ID_${builtActionId(key)}`, "");
    for (const [name, value] of Object.entries(fields)) body.append(name, value);
    const before = await readDatabaseState();
    const response = await fetch(`${baseUrl}${form.path(world)}`, {
      method: "POST",
      redirect: "manual",
      headers: { origin: "http://elsewhere.example", cookie: world.people.admin.cookie },
      body,
    });
    expect(response.status).toBe(403);
    expectNoInternals(await response.text());
    expect(changedTables(before, await readDatabaseState())).toEqual([]);
  });
});
