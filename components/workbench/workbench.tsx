"use client";

import { QueryClient, QueryClientProvider, useInfiniteQuery, useMutation, useQueryClient } from "@tanstack/react-query";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import type { LabChoices } from "@/lessons";
import { buildSimInput } from "@/lessons/build-run";
import type { RunChoices } from "@/lessons/schema";
import type { AttemptView } from "@/lib/grading";
import type { LabDraft } from "@/lib/lab-drafts";
import type { SimInput } from "@/lib/sim";
import { AttemptHistory } from "./attempt-history";
import { AttemptRequestError, fetchAttempt, listAttempts, newSubmissionKey, submitAttempt, type Submission, type SubmitReply } from "./attempts-api";
import type { WorkbenchSetup } from "./workbench-types";
import { WorkbenchPreview } from "./workbench-preview";
import { ChoiceControls } from "./choice-controls";
import { RunDrawing } from "./run-drawing";
import { describeChoices, runFacts } from "./run-facts";
import { RunTabs } from "./run-tabs";
import { ScenarioWords } from "./scenario-words";
import { SourceReadout } from "./source-readout";
import { SubmitPanel, type QuestionText } from "./submit-panel";
import { useControlDrag } from "./use-control-drag";
import { useDraftSaving, type DraftSaving } from "./use-draft-saving";
import { useNarrowScreen } from "./use-narrow-screen";

type Props = {
  setup: WorkbenchSetup;
  questionTexts: Record<string, QuestionText>;
  /** What the workbench opens with: the learner's latest saved choices and answers, or the scenario's own. */
  draft: LabDraft;
  /** When the server saved that draft (ms since the epoch); null when it has none. */
  savedAt: number | null;
  /** Where this browser keeps a change the server has not received yet: one key per learner and lab. */
  draftStorageKey: string;
};

type Replay = { attempt: AttemptView; inputs: Record<string, SimInput> };

/** The key of one submission: kept while the same submission is retried after a lost answer, new for anything else. */
type PendingKey = { payload: string; key: string };

export function Workbench(props: Props) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { retry: 1, refetchOnWindowFocus: false } } }));
  return (
    <QueryClientProvider client={client}>
      <WorkbenchPanels {...props} />
    </QueryClientProvider>
  );
}

const cardClass = "rounded-card border border-line bg-surface p-4 sm:p-6";

/** Whether the learner's latest choices and answers are kept, in a line under the controls' heading. */
function DraftStatus({ saving, onRetry }: { saving: DraftSaving; onRetry: () => void }) {
  if (saving.status === "failed") {
    return (
      <div role="alert" data-testid="draft-status" data-status="failed" className="mb-4 rounded-lg border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
        Your latest choices are not saved yet: {saving.message} They stay on this page meanwhile.{" "}
        <button type="button" onClick={onRetry} className="font-semibold underline underline-offset-2">
          Save again
        </button>
      </div>
    );
  }
  return (
    <p role="status" data-testid="draft-status" data-status={saving.status} className="mb-4 text-xs text-ink-faint">
      {saving.status === "saving" ? "Saving your choices…" : "Your choices and answers are saved; the workbench opens with them next time."}
    </p>
  );
}

function WorkbenchPanels({ setup, questionTexts, draft, savedAt, draftStorageKey }: Props) {
  const { runs, labSlug } = setup;
  const queryClient = useQueryClient();
  const historyKey = ["lab-attempts", labSlug] as const;

  const [choices, setChoices] = useState<LabChoices>(draft.choices);
  const [activeRunId, setActiveRunId] = useState(runs[0].id);
  const [answers, setAnswers] = useState<Record<string, string>>(draft.answers);
  const restore = useCallback((unsaved: LabDraft) => {
    setChoices(unsaved.choices);
    setAnswers(unsaved.answers);
  }, []);
  const { saving, retry } = useDraftSaving({ labSlug, draft: { choices, answers }, savedAt, storageKey: draftStorageKey, restore });
  const narrow = useNarrowScreen();
  const scopeSection = useRef<HTMLElement>(null);
  // On a phone the scope's words and the rule's judgement sit in a card below the controls.
  const [judgementSlot, setJudgementSlot] = useState<HTMLDivElement | null>(null);
  const [scopeWordsSlot, setScopeWordsSlot] = useState<HTMLDivElement | null>(null);
  // One object while the slots stay, so that the scope's memoised drawing is not redone on every render.
  const detailsIn = useMemo(
    () => (narrow && judgementSlot && scopeWordsSlot ? { judgement: judgementSlot, scope: scopeWordsSlot } : null),
    [narrow, judgementSlot, scopeWordsSlot],
  );
  const [replay, setReplay] = useState<Replay | null>(null);
  const [reply, setReply] = useState<SubmitReply | null>(null);
  const pendingKey = useRef<PendingKey | null>(null);
  const { dragging, startDrag } = useControlDrag();

  const history = useInfiniteQuery({
    queryKey: historyKey,
    queryFn: ({ pageParam }) => listAttempts(labSlug, pageParam),
    initialPageParam: null as string | null,
    getNextPageParam: (page) => page.nextCursor,
  });
  const attempts = history.data?.pages.flatMap((page) => page.attempts);

  const submit = useMutation({
    mutationFn: (submission: Submission) => submitAttempt(labSlug, submission),
    onSuccess: (result) => {
      pendingKey.current = null;
      setReply(result);
      void queryClient.invalidateQueries({ queryKey: historyKey });
    },
    onError: (error) => {
      if (!(error instanceof AttemptRequestError && error.retryable)) pendingKey.current = null;
    },
  });

  const reopen = useMutation({
    mutationFn: (attempt: AttemptView) => fetchAttempt(labSlug, attempt.id),
    onSuccess: ({ attempt, runs: stored }) => {
      setReplay({ attempt, inputs: Object.fromEntries(stored.map((run) => [run.runId, run.input])) });
    },
  });

  // A redrawn attempt is shown where the learner looks for it: the scope comes into view.
  const shownAttemptId = replay?.attempt.id;
  useEffect(() => {
    if (!shownAttemptId) return;
    const still = window.matchMedia("(prefers-reduced-motion: reduce)").matches;
    scopeSection.current?.scrollIntoView({ block: "start", behavior: still ? "auto" : "smooth" });
  }, [shownAttemptId]);

  const activeRun = runs.find((run) => run.id === activeRunId) ?? runs[0];
  const activeChoices = choices[activeRun.id];
  // While an attempt is redrawn, the drawing and the words describe that attempt, as the scope does.
  const facts = runFacts(activeRun, (replay && replay.attempt.choices[activeRun.id]) ?? activeChoices);
  const replayInput = replay?.inputs[activeRun.id];
  const previewInput = replayInput ?? buildSimInput(activeRun.scenario, activeChoices);

  const changeChoices = (runId: string, next: RunChoices) => {
    setReplay(null);
    setChoices((current) => ({ ...current, [runId]: next }));
  };

  const scenarioChoices: LabChoices = Object.fromEntries(runs.map((run) => [run.id, run.start]));
  const atScenario = JSON.stringify(choices) === JSON.stringify(scenarioChoices);
  const resetToScenario = () => {
    setReplay(null);
    setChoices(scenarioChoices);
  };

  const sendSubmission = () => {
    const submission = { choices, ...(setup.questions.length > 0 && { answers }) };
    const payload = JSON.stringify(submission);
    if (pendingKey.current?.payload !== payload) pendingKey.current = { payload, key: newSubmissionKey() };
    submit.mutate({ ...submission, idempotencyKey: pendingKey.current.key });
  };

  const submitError =
    submit.error instanceof AttemptRequestError
      ? { message: submit.error.message, fieldErrors: submit.error.fieldErrors }
      : submit.error
        ? { message: submit.error.message, fieldErrors: {} }
        : null;
  const nextAttempt = (attempts?.[0]?.attemptNumber ?? 0) + 1;

  return (
    <div className="space-y-6">
      {runs.length > 1 ? <RunTabs runs={runs} activeRunId={activeRun.id} onSelect={setActiveRunId} /> : null}
      <div role={runs.length > 1 ? "tabpanel" : undefined} id={`run-panel-${activeRun.id}`} aria-labelledby={runs.length > 1 ? `run-tab-${activeRun.id}` : undefined} className="space-y-6">
        <section className={cardClass} aria-labelledby="run-heading">
          <h2 id="run-heading" className="text-lg font-semibold">
            {activeRun.label}
          </h2>
          <div className="mt-3">
            <RunDrawing facts={facts} title={activeRun.label} />
          </div>
          <div className="mt-3">
            <ScenarioWords run={activeRun} facts={facts} />
          </div>
        </section>

        <div className="grid grid-cols-[minmax(0,1fr)] items-start gap-6 lg:grid-cols-[minmax(0,20rem)_minmax(0,1fr)]">
          <section className={`${cardClass} lg:sticky lg:top-6`} aria-labelledby="controls-heading" data-testid="controls-card">
            <div className="mb-1 flex flex-wrap items-baseline justify-between gap-x-3">
              <h2 id="controls-heading" className="text-lg font-semibold">
                Your choices
              </h2>
              <button
                type="button"
                onClick={resetToScenario}
                disabled={atScenario}
                className="text-sm font-semibold text-accent underline underline-offset-2 disabled:text-ink-faint disabled:no-underline"
              >
                {runs.length > 1 ? "Reset every run to the scenario" : "Reset to the scenario"}
              </button>
            </div>
            <DraftStatus saving={saving} onRetry={retry} />
            <ChoiceControls run={activeRun} choices={activeChoices} onChange={(next) => changeChoices(activeRun.id, next)} onDragStart={startDrag} />
            {replay ? (
              <p className="mt-4 text-sm text-ink-soft">
                These are your own choices. The drawing and the scope show attempt {replay.attempt.attemptNumber}; moving a control brings your choices back.
              </p>
            ) : activeRun.controls.seriesResistance || activeRun.controls.cable || activeRun.controls.driver ? (
              <SourceReadout facts={facts} />
            ) : null}
          </section>
          {/* On a phone the scope comes first and stays on screen while the controls below it scroll. */}
          <section
            ref={scopeSection}
            className={`${cardClass} scroll-mt-4 max-lg:sticky max-lg:top-0 max-lg:z-10 max-lg:order-first max-lg:p-3 max-lg:shadow-md`}
            aria-labelledby="scope-heading"
            data-testid="scope-card"
          >
            <h2 id="scope-heading" className="mb-3 text-lg font-semibold max-lg:mb-2 max-lg:text-base">
              {replay ? `Attempt ${replay.attempt.attemptNumber} on the scope` : "Try it on the workbench"}
            </h2>
            <WorkbenchPreview
              input={previewInput}
              dragging={dragging}
              rule={setup.passRule}
              caption={`Scope view of ${activeRun.label}`}
              scopeHeight={narrow ? 170 : 300}
              detailsIn={detailsIn}
              note={
                replay ? (
                  <div className="mb-4 flex flex-wrap items-center gap-3 rounded-lg border border-accent/30 bg-accent-soft px-3 py-2 text-sm" role="status">
                    <span>
                      Redrawn from attempt {replay.attempt.attemptNumber} as it was graded ({describeChoices(activeRun, replay.attempt.choices[activeRun.id])};{" "}
                      {replay.attempt.score} / 100).
                    </span>
                    <button type="button" className="font-semibold text-accent underline underline-offset-2" onClick={() => setReplay(null)}>
                      Back to my choices
                    </button>
                    <button
                      type="button"
                      className="font-semibold text-accent underline underline-offset-2"
                      onClick={() => {
                        setChoices((current) => ({ ...current, ...replay.attempt.choices }));
                        setReplay(null);
                      }}
                    >
                      Put these choices on the workbench
                    </button>
                  </div>
                ) : null
              }
            />
          </section>
          {narrow ? (
            <section className={cardClass} aria-label="What the scope shows" data-testid="scope-words-card">
              <div ref={setJudgementSlot} />
              <div ref={setScopeWordsSlot} className="mt-4" />
            </section>
          ) : null}
        </div>
      </div>

      <section className={cardClass} aria-labelledby="submit-heading">
        <h2 id="submit-heading" className="mb-4 text-lg font-semibold">
          Grading
        </h2>
        <SubmitPanel
          runs={runs}
          questions={setup.questions}
          questionTexts={questionTexts}
          answers={answers}
          onAnswer={(id, entry) => setAnswers((current) => ({ ...current, [id]: entry }))}
          onSubmit={sendSubmission}
          pending={submit.isPending}
          error={submitError}
          reply={reply}
          nextAttempt={nextAttempt}
          attempts={setup.attempts}
        />
      </section>

      <section className={cardClass} aria-labelledby="history-heading">
        <h2 id="history-heading" className="mb-2 text-lg font-semibold">
          Your attempts
        </h2>
        {reopen.error ? (
          <p role="alert" className="mb-2 text-sm text-danger">
            {reopen.error.message}
          </p>
        ) : null}
        <AttemptHistory
          runs={runs}
          attempts={attempts}
          loading={history.isPending}
          error={history.isError && !attempts ? history.error.message : null}
          olderAttempts={
            history.hasNextPage
              ? {
                  loading: history.isFetchingNextPage,
                  error: history.isFetchNextPageError ? history.error.message : null,
                  load: () => void history.fetchNextPage(),
                }
              : null
          }
          shownAttemptId={replay?.attempt.id ?? null}
          openingAttemptId={reopen.isPending ? (reopen.variables?.id ?? null) : null}
          onOpen={(attempt) => reopen.mutate(attempt)}
        />
      </section>
    </div>
  );
}
