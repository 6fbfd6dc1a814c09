/**
 * Benchmark of the live workbench in a real browser (Debian's chromium through playwright-core)
 * against a running, seeded app at E2E_BASE_URL: the time from a slider's input event to the
 * scope's redrawn far-end trace, while the resistor is dragged and once it is let go.
 *
 * Signed in as a demo learner with seeded work, on a lab whose run rings at its start (LABS), the
 * mouse holds the resistor's thumb and moves it one value at a time, waiting for each redraw:
 * each step is a drag redraw (the worker's preview, DRAG_SPAN). After letting go, the full run at
 * grading accuracy is drawn: the reference the ratio is taken against, in the same page. Keyboard
 * steps (a settled choice each, so a full run each) are timed too. Performance marks in the page
 * time each step: "slider-input" from the input event, "trace-redrawn" when the trace's path
 * changes, "trace-painted" at the next animation frame.
 *
 * Run with the app up, e.g. after `npm start` (E2E_BASE_URL=http://127.0.0.1:3000), as
 * `npm run -s bench:live:browser`; `--screenshots` also saves the scope mid-drag and after release
 * under test-results/screenshots/. Nothing here fails a build.
 */
import type { Page } from "playwright-core";
import { demoCohorts, demoLearnerEmail, demoPassword } from "@/db/demo-data";
import { launchBrowser, openPage, saveScreenshot, signInThroughForm } from "@/tests/e2e/support/browser";
import { median, table, verdict } from "./bench-sim-support";

/** Labs with a resistor slider, ringing at their start: the first the demo learner has unlocked is used. */
const LABS = ["lone-lead-termination", "overshoot-limit", "rc-window"];
const SLIDER = { name: /^Series resistor/ };
// The chart's far-end trace, or while a control is held the drag overlay's (the chart hides its own then).
const FAR_END_TRACE = 'path.recharts-line-curve[stroke="#b05f26"], [data-testid="drag-preview-traces"] path[data-trace="far"]';
const FRAME_MS = 16;
// The demo seed gives every learner but the first of a cohort work far into the course, so this
// one has the termination labs open.
const LEARNER = { email: demoLearnerEmail(demoCohorts[0].learners[1]), password: demoPassword };
const DRAG_STEPS = 12;
const KEY_STEPS = 6;

/**
 * Before the app's scripts: marks each message to the simulator's worker ("sim-request") and each
 * reply ("sim-reply"), so that a step's time splits into the page's render of the input, the
 * worker's round trip and the page's render of the result.
 */
async function markWorkerMessages(page: Page): Promise<void> {
  await page.addInitScript(() => {
    const post = Worker.prototype.postMessage;
    Worker.prototype.postMessage = function (this: Worker, ...args: Parameters<Worker["postMessage"]>) {
      performance.mark("sim-request");
      return post.apply(this, args);
    } as Worker["postMessage"];
    const Original = window.Worker;
    window.Worker = class extends Original {
      constructor(...args: ConstructorParameters<typeof Worker>) {
        super(...args);
        this.addEventListener("message", () => performance.mark("sim-reply"));
      }
    };
  });
}

/** In the page: marks each slider input and each change of the far-end trace (and the frame that shows it). */
function instrument(page: Page): Promise<void> {
  return page.evaluate(
    ({ traceSelector }) => {
      const state = { redraws: 0, lastD: document.querySelector(traceSelector)?.getAttribute("d") ?? "" };
      (window as unknown as { liveBench: typeof state }).liveBench = state;
      const slider = document.querySelector('input[type="range"]')!;
      slider.addEventListener("input", () => performance.mark("slider-input"), { capture: true });
      new MutationObserver(() => {
        const d = document.querySelector(traceSelector)?.getAttribute("d") ?? "";
        if (d === state.lastD) return;
        state.lastD = d;
        performance.mark("trace-redrawn");
        requestAnimationFrame(() => {
          performance.mark("trace-painted");
          state.redraws += 1;
        });
      }).observe(document.querySelector('[data-testid="workbench-preview"]')!, { subtree: true, childList: true, attributes: true, attributeFilter: ["d"] });
    },
    { traceSelector: FAR_END_TRACE },
  );
}

type Step = {
  redrawnMs: number;
  paintedMs: number;
  /** The simulation alone, as the worker reports it. */
  workerMs: number;
  /** Input event to the request posted to the worker (the page renders the new choice). */
  toRequestMs: number;
  /** Request to reply (the worker's simulation, messaging and any wait for a run still in progress). */
  roundTripMs: number;
  /** Reply to the trace redrawn (the page renders the result: scope and chart). */
  toRedrawMs: number;
};

/** After one input: waits for the redraw and reads the marks (from the newest input to the redraw and to the painted frame). */
async function awaitStep(page: Page, redrawsBefore: number): Promise<Step> {
  await page.waitForFunction((before) => (window as unknown as { liveBench: { redraws: number } }).liveBench.redraws > before, redrawsBefore, { timeout: 30_000 });
  // No functions declared inside: the page runs this callback's source as it is (without the bundler's helpers).
  return page.evaluate(() => {
    const [input, request, reply, redrawn, painted] = ["slider-input", "sim-request", "sim-reply", "trace-redrawn", "trace-painted"].map(
      (name) => performance.getEntriesByName(name).at(-1)?.startTime ?? Number.NaN,
    );
    const badge = document.querySelector('[data-testid="resimulation-time"]')?.getAttribute("title") ?? "";
    return {
      redrawnMs: redrawn - input,
      paintedMs: painted - input,
      workerMs: Number.parseFloat(/Simulated in ([\d.]+) ms/.exec(badge)?.[1] ?? "NaN"),
      toRequestMs: request - input,
      roundTripMs: reply - request,
      toRedrawMs: redrawn - reply,
    };
  });
}

const redraws = (page: Page) => page.evaluate(() => (window as unknown as { liveBench: { redraws: number } }).liveBench.redraws);
const shownValue = (page: Page) => page.locator("output").first().innerText();

async function dragSteps(page: Page, screenshots: boolean): Promise<{ steps: Step[]; release: Step }> {
  const slider = page.getByRole("slider", SLIDER);
  await slider.scrollIntoViewIfNeeded();
  const box = (await slider.boundingBox())!;
  const count = Number(await slider.getAttribute("max")) + 1;
  const index = Number(await slider.inputValue());
  const pitch = box.width / (count - 1);
  const y = box.y + box.height / 2;
  let x = box.x + (index / (count - 1)) * box.width;
  await page.mouse.move(x, y);
  await page.mouse.down();
  await page.waitForTimeout(300);
  const steps: Step[] = [];
  for (let i = 0; i < DRAG_STEPS; i += 1) {
    const before = await redraws(page);
    const value = await shownValue(page);
    for (let nudge = 0; nudge < 4 && (await shownValue(page)) === value; nudge += 1) {
      x += pitch / 2;
      await page.mouse.move(x, y);
    }
    steps.push(await awaitStep(page, before));
    if (screenshots && i === DRAG_STEPS / 2) await saveScreenshot(page, "live-drag-mid-drag");
  }
  const before = await redraws(page);
  await page.evaluate(() => performance.mark("slider-input"));
  await page.mouse.up();
  const release = await awaitStep(page, before);
  await page.locator('[data-testid="workbench-preview"][data-pending="false"]').waitFor({ timeout: 30_000 });
  if (screenshots) await saveScreenshot(page, "live-drag-released");
  return { steps, release };
}

async function keyboardSteps(page: Page): Promise<Step[]> {
  const slider = page.getByRole("slider", SLIDER);
  await slider.focus();
  const steps: Step[] = [];
  for (let i = 0; i < KEY_STEPS; i += 1) {
    const before = await redraws(page);
    await page.keyboard.press(i % 2 === 0 ? "ArrowLeft" : "ArrowRight");
    steps.push(await awaitStep(page, before));
    await page.locator('[data-testid="workbench-preview"][data-pending="false"]').waitFor({ timeout: 30_000 });
  }
  return steps;
}

function summary(name: string, steps: Step[]): string[] {
  const of = (pick: (s: Step) => number) => steps.map(pick);
  return [
    name,
    String(steps.length),
    median(of((s) => s.workerMs)).toFixed(1),
    median(of((s) => s.toRequestMs)).toFixed(1),
    median(of((s) => s.roundTripMs)).toFixed(1),
    median(of((s) => s.toRedrawMs)).toFixed(1),
    median(of((s) => s.redrawnMs)).toFixed(1),
    Math.max(...of((s) => s.redrawnMs)).toFixed(1),
    median(of((s) => s.paintedMs)).toFixed(1),
    Math.max(...of((s) => s.paintedMs)).toFixed(1),
  ];
}

async function openFirstUnlockedLab(page: Page): Promise<string> {
  for (const lab of LABS) {
    await page.goto(`/labs/${lab}`);
    if ((await page.getByRole("slider", SLIDER).count()) > 0) return lab;
  }
  throw new Error(`${LEARNER.email} has none of ${LABS.join(", ")} unlocked`);
}

async function main() {
  const screenshots = process.argv.includes("--screenshots");
  const browser = await launchBrowser();
  try {
    const { page } = await openPage(browser, "wide");
    await markWorkerMessages(page);
    await signInThroughForm(page, LEARNER);
    const lab = await openFirstUnlockedLab(page);
    await page.locator('[data-testid="workbench-preview"][data-pending="false"]').waitFor({ timeout: 60_000 });
    await page.locator(FAR_END_TRACE).first().waitFor({ timeout: 60_000 });
    await instrument(page);
    // Warm-up: the worker's code and the chart's first layouts.
    await dragSteps(page, false);
    const { steps, release } = await dragSteps(page, screenshots);
    const keys = await keyboardSteps(page);

    const scenario = await page.getByRole("heading", { level: 1 }).innerText();
    console.log(`live workbench in chromium (${browser.version()}), lab ${lab} ("${scenario}", the learner's own variant), as ${LEARNER.email}`);
    console.log("medians in ms (and the worst step); simulation: as the worker reports it; the three middle columns split input→redraw\n");
    console.log(
      table(
        ["step", "n", "simulation", "input→request", "worker round trip", "reply→redraw", "input→redraw", "worst", "input→painted", "worst"],
        [summary("drag (preview while held)", steps), summary("release (full run)", [release]), summary("keyboard step (full run)", keys)],
      ),
    );
    const dragMedian = median(steps.map((s) => s.redrawnMs));
    const fullMedian = median(keys.map((s) => s.redrawnMs));
    const worstDrag = Math.max(...steps.map((s) => s.redrawnMs));
    console.log(`\ndrag redraw / full-run redraw (medians, same page): ${(dragMedian / fullMedian).toFixed(2)}×`);
    console.log(`drag redraw within one animation frame (${FRAME_MS} ms) from input to the redrawn trace: median ${dragMedian.toFixed(1)} ms, worst ${worstDrag.toFixed(1)} ms — ${verdict(dragMedian < FRAME_MS)} (median), ${verdict(worstDrag < FRAME_MS)} (worst)`);
  } finally {
    await browser.close();
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
