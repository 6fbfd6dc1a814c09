// A server action's arguments arrive in React's reply format, which the browser writes with
// `encodeReply` and Next reads with React's `decodeReply` before the action runs: numbered JSON
// parts, part 0 holding the arguments, where a string starting with "$" stands for something JSON
// cannot hold (a reference to another part, form data, a date, undefined…). React throws on a part
// that is not JSON, a reference to a missing part, nesting deeper than it can follow, more array
// items than its limit, and kinds of values it cannot rebuild here, and Next answers each with a
// 500. This check names the problem first, accepting only what React rebuilds without error.

export const replyLimits = {
  /** Far deeper than any form's arguments (a previous state holds a few levels of objects). */
  depth: 32,
  /** React's own limit on array items in one reply, counted as React counts them (or more). */
  arraySlots: 1_000_000,
  /** Next refuses an action called with more arguments. */
  arguments: 1000,
  /** React refuses longer BigInt text. */
  bigintDigits: 300,
} as const;

/** The text of part `id`, or undefined when the reply has no such text part. */
export type ReplyPart = (id: number) => string | undefined;

/** "arguments": an action's argument list; "descriptor": a no-script form's `{ id, bound }` action. */
export type ReplyRoot = "arguments" | "descriptor";

class ReplyProblem extends Error {}

/** Why React could not rebuild this reply, as a sentence, or null when it can. */
export function findReplyProblem(part: ReplyPart, root: ReplyRoot): string | null {
  try {
    new ReplyCheck(part).run(root);
    return null;
  } catch (error) {
    if (error instanceof ReplyProblem) return error.message;
    throw error;
  }
}

// Strings React reads as a value of its own without looking at another part.
const plainTokens = /^\$(?:\$.*|K[0-9a-f]{1,8}|undefined|Infinity|-Infinity|-0|NaN|D.*)$/s;
const bigint = new RegExp(`^\\$n-?[0-9]{1,${replyLimits.bigintDigits}}$`);
// "$@1" (a promise of part 1), "$1" (part 1 itself), "$1:key:0" (a value inside part 1).
const partReference = /^\$(@?)([0-9a-f]{1,8})((?::[^:]*)*)$/;

class ReplyCheck {
  private readonly parsed = new Map<number, unknown>();
  private readonly walked = new Set<number>();
  private readonly walking = new Set<number>();
  private readonly slotsOfNode = new WeakMap<object, number>();
  /** Values referred to by "$1" or "$1:key": counted once every part is known to be shallow. */
  private readonly referred: unknown[] = [];
  private slots = 0;

  constructor(private readonly part: ReplyPart) {}

  run(root: ReplyRoot): void {
    const value = this.parse(0);
    if (root === "arguments" && !Array.isArray(value)) throw new ReplyProblem("The action's arguments are not a list.");
    if (root === "arguments" && (value as unknown[]).length > replyLimits.arguments) {
      throw new ReplyProblem(`An action takes at most ${replyLimits.arguments} arguments.`);
    }
    if (root === "descriptor" && !isRecord(value)) throw new ReplyProblem("The form names no action.");
    this.walk(0, 0);
    // React counts the list items of a value each time it is referred to.
    for (const target of this.referred) this.count(this.slotsOf(target));
  }

  private parse(id: number): unknown {
    if (this.parsed.has(id)) return this.parsed.get(id);
    const text = this.part(id);
    if (text === undefined) throw new ReplyProblem(`It refers to part ${id}, which was not sent.`);
    let value: unknown;
    try {
      value = JSON.parse(text);
    } catch {
      throw new ReplyProblem(`Part ${id} is not JSON.`);
    }
    this.parsed.set(id, value);
    return value;
  }

  private count(slots: number): void {
    this.slots += slots;
    if (this.slots > replyLimits.arraySlots) throw new ReplyProblem("It holds more list items than an action may receive.");
  }

  /** Every value of part `id`, which sits `depth` levels down from part 0. */
  private walk(id: number, depth: number): void {
    this.walking.add(id);
    const pending: [unknown, number][] = [[this.parse(id), depth]];
    for (let next = pending.pop(); next; next = pending.pop()) {
      const [value, level] = next;
      if (level > replyLimits.depth) throw new ReplyProblem("It is nested too deeply.");
      if (typeof value === "string") {
        if (value.startsWith("$")) this.reference(value, level);
        continue;
      }
      if (value === null || typeof value !== "object") continue;
      if (Array.isArray(value)) this.count(value.length + 1);
      for (const child of Object.values(value)) pending.push([child, level + 1]);
    }
    this.walking.delete(id);
    this.walked.add(id);
  }

  private reference(value: string, level: number): void {
    if (plainTokens.test(value)) {
      if (value.startsWith("$$")) this.count(value.length);
      return;
    }
    if (bigint.test(value)) return this.count(value.length);
    const match = partReference.exec(value);
    if (!match) throw new ReplyProblem("It holds a kind of value that forms never send.");
    const [, promise, hex, path] = match;
    const id = parseInt(hex!, 16);
    const keys = path ? path.split(":").slice(1) : [];
    // A part that refers back to itself through its whole value never finishes being read.
    if (keys.length === 0 && !promise && this.walking.has(id)) throw new ReplyProblem(`Part ${id} refers to itself.`);
    if (keys.length > 0 && promise) throw new ReplyProblem("It holds a kind of value that forms never send.");
    if (!this.walked.has(id) && !this.walking.has(id)) this.walk(id, level + 1);
    const target = this.resolve(id, keys);
    if (!promise) this.referred.push(target);
  }

  /** The value at `keys` inside part `id`: React follows a path through plain objects and lists only. */
  private resolve(id: number, keys: string[]): unknown {
    let value = this.parse(id);
    for (const key of keys) {
      if (key === "__proto__" || value === null || typeof value !== "object" || !Object.hasOwn(value, key)) {
        throw new ReplyProblem(`It refers to a value that part ${id} does not hold.`);
      }
      value = (value as Record<string, unknown>)[key];
    }
    if (keys.length > 0 && (value === null || typeof value !== "object")) throw new ReplyProblem(`It refers to a value that part ${id} does not hold.`);
    return value;
  }

  private slotsOf(value: unknown): number {
    if (value === null || typeof value !== "object") return 0;
    const known = this.slotsOfNode.get(value);
    if (known !== undefined) return known;
    let slots = Array.isArray(value) ? value.length + 1 : 0;
    for (const child of Object.values(value)) slots += this.slotsOf(child);
    this.slotsOfNode.set(value, slots);
    return slots;
  }
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === "object" && !Array.isArray(value);
}
