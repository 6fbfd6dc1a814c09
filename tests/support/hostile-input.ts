import fc from "fast-check";
import { expect } from "vitest";

// Hostile values shared by the property tests that attack route handlers (JSON bodies) and
// server actions (form data), and the check that no answer shows the app's insides.

/** Keys that name the prototype's own members, as a prototype-pollution attempt sends them. */
export const pollutingKey = fc.constantFrom("__proto__", "constructor", "prototype", "toString", "hasOwnProperty");

/** 100 k to 2 M characters: the length of a huge text, for tests that build it only when sending. */
export const hugeLength = fc.integer({ min: 100_000, max: 2_000_000 });

/** 100 kB to 4 MB of a two-byte character. */
export const hugeString = hugeLength.map((length) => "Ω".repeat(length));

/** Short text that is not what any field expects: random, binary, path tricks, injections, odd whitespace. */
export const hostileText = fc.oneof(
  fc.string({ maxLength: 80 }),
  fc.string({ unit: "binary", maxLength: 80 }),
  fc.uuid(),
  fc.constantFrom("../../etc/passwd", "..%2F..%2F", "%00", "' or '1'='1", "<script>x</script>", "x".repeat(10_000), "NaN", "-1", " ", "\n"),
);

/** A stack frame, an error class name with a path, or a source path: nothing a visitor should read. */
export function expectNoInternals(text: string, context?: string): void {
  expect(text, context).not.toMatch(/\n\s+at\s|\bat\s+\S+\s+\(|node_modules|\/work\/|\.tsx?:\d+|TypeError|RangeError|SyntaxError/);
}
