/**
 * Hostile input for every server action, sent over HTTP as a persona allowed to use it: valid
 * calls with at least one field, bound argument or the form itself spoiled — removed, replaced by
 * random, binary, unicode or huge text, by a file, by an id of nothing, by a value of another
 * type — plus junk and prototype-polluting keys and a forged previous state; then bodies that are
 * no valid call at all (not JSON, cut short, multipart without or with the wrong boundary, binary,
 * empty, huge, references to parts never sent…), each with its length declared and chunked.
 * Never a 500 or a stack trace: the action's own error state or a 4xx in the app's JSON error
 * format, and not one row written.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { uniqueLoopbackAddress } from "../support/loopback-client";
import { expectNoInternals, hostileBodies, hostileText, hugeLength, pollutingKey } from "../support/hostile-input";
import { actionForms, planActionCall, type ActionForm, type FieldValue } from "./support/action-forms";
import { setUpAccessWorld, type AccessWorld } from "./support/access-world";
import { builtActionId } from "./support/app-surface";
import { changedTables, readDatabaseState } from "./support/database-state";
import { rawPost } from "./support/raw-post";
import { callAction, isRefusalState, readActionResult, type ActionReply } from "./support/server-actions";

const runsPerAction = 12;

let world: AccessWorld;
setUpAccessWorld((built) => (world = built));

const unicodeText = fc.string({ unit: "grapheme", minLength: 1, maxLength: 200 });
const fileValue = fc
  .tuple(fc.uint8Array({ maxLength: 2000 }), fc.oneof(fc.string({ maxLength: 40 }), fc.constantFrom("roster.csv", "../x.png", "")))
  .map(([bytes, name]) => new File([bytes], name, { type: "application/octet-stream" }));
/** Huge text stays a length until it is sent, so a failure report does not print megabytes. */
type HugeText = { hugeText: number };
/** A value for a form field that is not what the field expects. */
const hostileField: fc.Arbitrary<FieldValue | HugeText> = fc.oneof(
  { arbitrary: hostileText, weight: 4 },
  { arbitrary: unicodeText, weight: 2 },
  { arbitrary: fileValue, weight: 1 },
  { arbitrary: hugeLength.map((length) => ({ hugeText: length })), weight: 1 },
);
const fieldValue = (value: FieldValue | HugeText): FieldValue => (typeof value === "object" && "hugeText" in value ? "Ω".repeat(value.hugeText) : value);
/** As a browser would send it: a plain object (fast-check builds dictionaries without a prototype, which React will not encode). */
const plain = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T;
/** A value for a bound argument: text as above, or not text at all. */
const hostileArgument: fc.Arbitrary<unknown> = fc.oneof(
  hostileText,
  fc.integer(),
  fc.constantFrom(null, true, -0, 1e308),
  fc.array(fc.string({ maxLength: 20 }), { maxLength: 3 }),
  fc.dictionary(pollutingKey, fc.string({ maxLength: 20 })).map(plain),
);
type Spoil = { remove: true } | { remove: false; value: FieldValue | HugeText };
const spoil: fc.Arbitrary<Spoil> = fc.oneof(
  fc.constant({ remove: true as const }),
  hostileField.map((value) => ({ remove: false as const, value })),
);

const attack = fc.record({
  target: fc.nat(),
  spoil,
  argument: hostileArgument,
  others: fc.array(fc.tuple(fc.nat(), spoil), { maxLength: 3 }),
  junk: fc.array(fc.tuple(fc.oneof(pollutingKey, fc.string({ maxLength: 20 })), hostileField), { maxLength: 3 }),
  previous: fc.oneof(fc.jsonValue({ maxDepth: 3 }), fc.dictionary(pollutingKey, fc.jsonValue({ maxDepth: 2 }))).map(plain),
});
type Attack = typeof attack extends fc.Arbitrary<infer T> ? T : never;

/** What the allowed persona sends, with the attack applied: one guarded part always spoiled. */
async function hostileCall(form: ActionForm, attackPlan: Attack) {
  const plan = await planActionCall(form, world, form.allowed, world.people[form.allowed].cookie);
  const boundCount = form.fields ? plan.args.length - 2 : plan.args.length;
  const bound = plan.args.slice(0, boundCount);
  // Anyone can call an action with any arguments, so the form itself may arrive as something else.
  const targets: ({ name: string } | { index: number } | { wholeForm: true })[] = [
    ...(form.guarded ?? []).map((name) => ({ name })),
    ...(form.guardedArgs ?? []).map((index) => ({ index })),
    ...(form.fields ? [{ wholeForm: true as const }] : []),
  ];
  const target = targets[attackPlan.target % targets.length]!;
  if ("index" in target) bound[target.index] = attackPlan.argument;
  if (!form.fields) return { ...plan, args: bound, spoiled: `argument ${"index" in target ? target.index : ""}` };
  if ("wholeForm" in target) return { ...plan, args: [...bound, attackPlan.previous, attackPlan.argument], spoiled: "the whole form" };

  const fields = [...(plan.args.at(-1) as FormData).entries()];
  const values = new Map<string, FieldValue[]>(fields.map(([name]) => [name, fields.filter(([other]) => other === name).map(([, value]) => value)]));
  const names = [...values.keys()];
  for (const [pick, change] of attackPlan.others) apply(values, names[pick % names.length]!, change);
  if ("name" in target) apply(values, target.name, attackPlan.spoil);
  const sent = new FormData();
  for (const [name, list] of values) for (const value of list) sent.append(name, value);
  for (const [name, value] of attackPlan.junk) sent.append(name, fieldValue(value));
  return { ...plan, args: [...bound, attackPlan.previous, sent], spoiled: "name" in target ? target.name : `argument ${target.index}` };
}

function apply(values: Map<string, FieldValue[]>, name: string, change: Spoil): void {
  if (change.remove) values.delete(name);
  else values.set(name, [fieldValue(change.value)]);
}

/** A refusal the person can read: the action's error state, or a 4xx from the framework or the proxy. */
function expectClearRefusal(reply: ActionReply, context: string): void {
  expect(reply.status, `${context} → ${reply.status} ${reply.body.slice(0, 300)}`).toBeLessThan(500);
  expectNoInternals(reply.body, context);
  if (reply.status >= 400) return;
  expect(reply.redirect, `${context}: the action went on to ${reply.redirect}`).toBeNull();
  expect(reply.threw, `${context}: the action threw`).toBe(false);
  const result = reply.result;
  expect(isRefusalState(result), `${context}: not a refusal: ${JSON.stringify(result).slice(0, 300)}`).toBe(true);
  const message = (result as { message?: unknown }).message;
  expect(typeof message === "string" && message.length > 10, `${context}: no message`).toBe(true);
}

// Signing out takes no input: whatever is sent, it ends the session it came with.
const withInput = Object.entries(actionForms).filter(([, form]) => form.guarded || form.guardedArgs);

describe("hostile input on every server action", () => {
  it("covers every action that takes input", () => {
    expect(Object.keys(actionForms).filter((key) => !withInput.some(([other]) => other === key))).toEqual(["app/(auth)/sign-out/actions.ts#signOut"]);
  });

  for (const [key, form] of withInput) {
    it(`${key.split("#")[1]} refuses spoiled input clearly and writes nothing`, async () => {
      const actionId = builtActionId(key);
      await fc.assert(
        fc.asyncProperty(attack, async (attackPlan) => {
          const { spoiled, ...call } = await hostileCall(form, attackPlan);
          const before = await readDatabaseState(form.bookkeeping);
          const reply = await callAction({ ...call, actionId, from: uniqueLoopbackAddress() });
          expectClearRefusal(reply, `${key} with ${spoiled} spoiled`);
          expect(changedTables(before, await readDatabaseState(form.bookkeeping)), `${key} with ${spoiled} spoiled`).toEqual([]);
        }),
        // Each run is a round trip to the app; shrinking a failure would take minutes, and the
        // counterexample with the spoiled part named is readable as it is.
        { numRuns: runsPerAction, endOnFailure: true },
      );
    });
  }
});

/** A body that is no valid call: a 4xx from the proxy in the app's JSON format, or the action's own refusal. */
function expectBodyRefused(reply: { status: number; text: string; redirect: string | null }, guardsInput: boolean, context: string): void {
  expect(reply.status, `${context} → ${reply.status} ${reply.text.slice(0, 300)}`).toBeLessThan(500);
  expectNoInternals(reply.text, context);
  if (reply.status >= 400) {
    const { error } = JSON.parse(reply.text) as { error: { code: string; message: string } };
    expect(error.message.length, context).toBeGreaterThan(10);
    return;
  }
  // Signing out takes no input, so any call of it signs out.
  if (!guardsInput) return;
  expect(reply.redirect, `${context}: the action went on to ${reply.redirect}`).toBeNull();
  const { result } = readActionResult(reply.text);
  expect(isRefusalState(result), `${context}: not a refusal: ${JSON.stringify(result).slice(0, 300)}`).toBe(true);
}

describe("bodies that are no valid call, on every server action", () => {
  // Larger than the largest form's limit, so every page refuses it.
  const bodies = hostileBodies(2 * 1024 * 1024);

  for (const [key, form] of Object.entries(actionForms)) {
    it(`${key.split("#")[1]} refuses every malformed kind, chunked and with a length, and writes nothing`, async () => {
      const actionId = builtActionId(key);
      const plan = await planActionCall(form, world, form.allowed, world.people[form.allowed].cookie);
      const guardsInput = Boolean(form.guarded || form.guardedArgs);
      // Signing out ends the session it is sent with, whatever else it is sent.
      const bookkeeping = guardsInput ? form.bookkeeping : [...(form.bookkeeping ?? []), "sessions"];
      const before = await readDatabaseState(bookkeeping);
      for (const { kind, contentType, body } of bodies) {
        for (const chunked of [false, true]) {
          // As a script sends an action (its id in a header), and multipart kinds also as a form posted without scripts.
          for (const script of contentType?.startsWith("multipart/") ? [true, false] : [true]) {
            const headers: Record<string, string> = {
              ...(script ? { "next-action": actionId, accept: "text/x-component" } : {}),
              ...(contentType ? { "content-type": contentType } : {}),
              ...(plan.cookie ? { cookie: plan.cookie } : {}),
            };
            const reply = await rawPost({ path: plan.path, headers, body, chunked, from: uniqueLoopbackAddress() });
            const redirect = typeof reply.headers["x-action-redirect"] === "string" ? reply.headers["x-action-redirect"] : null;
            expectBodyRefused({ ...reply, redirect }, guardsInput, `${key}: ${kind}${chunked ? ", chunked" : ""}${script ? "" : ", without scripts"}`);
          }
        }
      }
      expect(changedTables(before, await readDatabaseState(bookkeeping)), key).toEqual([]);
    });
  }
});
