/**
 * The proxy's check of a body posted to a page, against what Next and React accept: every body the
 * app's own forms send, encoded by the copy of React that Next bundles, passes; each malformed kind
 * is named, never thrown.
 */
import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import { findActionBodyProblem } from "@/lib/http/action-body";
import { findReplyProblem, replyLimits } from "@/lib/http/action-reply";
import { hostileBodies } from "../../support/hostile-input";

const require = createRequire(import.meta.url);
const { encodeReply } = require("next/dist/compiled/react-server-dom-webpack/client.node.js") as {
  encodeReply: (value: unknown[]) => Promise<string | FormData>;
};

/** The request a browser sends for this call of an action: headers and body bytes. */
async function encodedCall(args: unknown[]): Promise<{ headers: Headers; body: Uint8Array<ArrayBuffer> }> {
  const encoded = await encodeReply(args);
  const request = new Request("http://app.test/", { method: "POST", body: encoded });
  const headers = new Headers({ "next-action": "7f".repeat(21) });
  headers.set("content-type", typeof encoded === "string" ? "text/plain;charset=UTF-8" : request.headers.get("content-type")!);
  return { headers, body: new Uint8Array(await request.arrayBuffer()) };
}

function form(fields: Record<string, string | File>): FormData {
  const data = new FormData();
  for (const [name, value] of Object.entries(fields)) data.append(name, value);
  return data;
}

const textPart = (text: string) => (id: number) => (id === 0 ? text : undefined);

describe("a server action's body as the app's forms send it", () => {
  it.each([
    ["bound arguments and a form", ["build-a-run", { status: "idle" }, form({ cable: "cat5", note: "$ and a dollar" })]],
    ["a previous error state and a file", [{ status: "error", message: "Check the fields.", fieldErrors: { email: "Enter an e-mail address." }, values: { email: "a@" } }, form({ file: new File(["name,email\n"], "roster.csv", { type: "text/csv" }) })]],
    ["bound arguments only", ["build-a-run", "3f2b8c1e-9a4d-4e6b-8c7a-1d2e3f4a5b6c"]],
    ["values JSON cannot hold", [undefined, Number.NaN, -0, Infinity, new Date(0), 12n]],
    ["an object given twice, sent once and referred to by its path", (() => {
      const shared = { status: "idle" };
      return [{ first: shared, second: shared }, [shared]];
    })()],
  ])("passes %s", async (_, args) => {
    const { headers, body } = await encodedCall(args as unknown[]);
    expect(await findActionBodyProblem(headers, body)).toBeNull();
  });

  it("passes a form posted without scripts, by action id or with bound arguments", async () => {
    const byId = new Request("http://app.test/", { method: "POST", body: form({ [`$ACTION_ID_${"7f".repeat(21)}`]: "", email: "a@example.test" }) });
    const bound = new Request("http://app.test/", {
      method: "POST",
      body: form({ $ACTION_REF_1: "", "$ACTION_1:0": `{"id":"${"7f".repeat(21)}","bound":"$@1"}`, "$ACTION_1:1": '["build-a-run"]', $ACTION_KEY: "k0", cable: "cat5" }),
    });
    for (const request of [byId, bound]) {
      const headers = new Headers({ "content-type": request.headers.get("content-type")! });
      expect(await findActionBodyProblem(headers, new Uint8Array(await request.arrayBuffer()))).toBeNull();
    }
  });

  it("leaves posts that Next does not read as actions to Next", async () => {
    const body = new TextEncoder().encode("anything at all");
    expect(await findActionBodyProblem(new Headers({ "content-type": "text/plain" }), body)).toBeNull();
    expect(await findActionBodyProblem(new Headers(), body)).toBeNull();
  });
});

describe("a malformed server action body", () => {
  for (const { kind, contentType, body } of hostileBodies(1000)) {
    if (["JSON array of numbers", "JSON object with polluting keys", "no content type", "huge body"].includes(kind)) continue;
    it(`is named, not thrown: ${kind}`, async () => {
      const headers = new Headers({ "next-action": "7f".repeat(21), ...(contentType ? { "content-type": contentType } : {}) });
      const problem = await findActionBodyProblem(headers, body);
      expect(problem).toMatch(/^This form could not be read/);
    });
  }

  it("is named when posted without scripts: no boundary, cut short, no action, a broken descriptor", async () => {
    const problems = await Promise.all(
      hostileBodies(1000)
        .filter(({ contentType }) => contentType?.startsWith("multipart/form-data"))
        .map(({ contentType, body }) => findActionBodyProblem(new Headers({ "content-type": contentType! }), body)),
    );
    expect(problems.every((problem) => problem?.startsWith("This form could not be read"))).toBe(true);
    const broken = new Request("http://app.test/", { method: "POST", body: form({ $ACTION_REF_1: "", "$ACTION_1:0": '{"id":"7f","bound":"$@1"}' }) });
    const headers = new Headers({ "content-type": broken.headers.get("content-type")! });
    expect(await findActionBodyProblem(headers, new Uint8Array(await broken.arrayBuffer()))).toMatch(/part 1, which was not sent/);
  });
});

describe("the reply format check", () => {
  it("refuses more array items than React decodes, counting each reference to a list again", () => {
    const list = JSON.stringify(Array.from({ length: 2000 }, () => 0));
    const references = Array.from({ length: 600 }, () => '"$1"');
    const part = (id: number) => (id === 0 ? `[${references.join(",")}]` : id === 1 ? list : undefined);
    expect(findReplyProblem(part, "arguments")).toMatch(/more list items/);
    expect(findReplyProblem(textPart(`["$$${"x".repeat(replyLimits.arraySlots)}"]`), "arguments")).toMatch(/more list items/);
  });

  it("refuses a part that is itself, more arguments than Next passes, and nesting past its depth", () => {
    expect(findReplyProblem((id) => (id === 0 ? '["$1"]' : '{"again":"$1"}'), "arguments")).toMatch(/refers to itself/);
    expect(findReplyProblem(textPart(JSON.stringify(Array.from({ length: replyLimits.arguments + 1 }, () => 0))), "arguments")).toMatch(/at most 1000 arguments/);
    const deep = "[".repeat(replyLimits.depth + 2) + "]".repeat(replyLimits.depth + 2);
    expect(findReplyProblem(textPart(deep), "arguments")).toMatch(/nested too deeply/);
    // Depth counts across parts: a chain of references is as deep as the nesting it stands for.
    const chain = (id: number) => (id <= replyLimits.depth + 1 ? `["$${(id + 1).toString(16)}"]` : "[]");
    expect(findReplyProblem(chain, "arguments")).toMatch(/nested too deeply/);
  });

  it("refuses every kind of value the app's forms never send", () => {
    for (const token of ["$T", "$F1", "$B1", "$i1", "$W1", "$R1", "$A1", "$Z", "$", "$1:", "$@1:a", "$zz", "$123456789"]) {
      const part = (id: number) => (id === 0 ? JSON.stringify([token]) : id === 1 ? "[]" : undefined);
      expect(findReplyProblem(part, "arguments"), token).not.toBeNull();
    }
  });
});
