"use client";

import Link from "next/link";
import { startTransition, useActionState, useState } from "react";
import { buttonClass } from "@/components/ui/button-class";
import { maxRosterFileBytes, rosterFileLimitLabel } from "@/lib/enrolment/roster-file";
import { StatusNotice } from "../../../status-notice";
import { rosterImportAction, type RosterImportState } from "./actions";
import { RosterPreviewTable } from "./roster-preview-table";

type Intent = "preview" | "import";

const count = (value: number) => value.toLocaleString("en-GB");

/**
 * Choose a file → check it (the server classifies every row; nothing is written) → import the
 * valid rows. The chosen file is kept here so the import sends the same bytes that were checked.
 */
export function RosterImport(props: { cohortId: string; cohortName: string }) {
  const [round, setRound] = useState(0);
  return <RosterImportRound key={round} {...props} onRestart={() => setRound((value) => value + 1)} />;
}

function RosterImportRound({ cohortId, cohortName, onRestart }: { cohortId: string; cohortName: string; onRestart: () => void }) {
  const [state, dispatch, pending] = useActionState<RosterImportState, FormData>(rosterImportAction, { status: "idle" });
  const [file, setFile] = useState<File | null>(null);
  const [localProblem, setLocalProblem] = useState<string | null>(null);
  const [intent, setIntent] = useState<Intent>("preview");

  const send = (next: Intent, expectedValid?: number) => {
    if (!file) {
      setLocalProblem("Choose a CSV file first.");
      return;
    }
    if (file.size > maxRosterFileBytes) {
      setLocalProblem(`The file is larger than ${rosterFileLimitLabel}. Split it into smaller files and import them one after another.`);
      return;
    }
    setLocalProblem(null);
    setIntent(next);
    const body = new FormData();
    body.set("intent", next);
    body.set("cohortId", cohortId);
    body.set("file", file);
    if (expectedValid !== undefined) body.set("expectedValid", String(expectedValid));
    startTransition(() => dispatch(body));
  };

  const preview = state.status === "preview" ? state.preview : state.status === "problem" ? state.preview : null;
  const imported = state.status === "imported" ? state : null;
  const validCount = preview?.counts.valid ?? 0;

  return (
    <div className="space-y-5">
      {imported ? null : (
        <form
          noValidate
          onSubmit={(event) => {
            event.preventDefault();
            send("preview");
          }}
          className="space-y-1.5"
        >
          <label htmlFor="roster-file" className="block text-sm font-medium text-ink">
            CSV file
          </label>
          <div className="flex flex-wrap gap-3">
            <input
              id="roster-file"
              name="file"
              type="file"
              accept=".csv,.txt,text/csv,text/plain"
              aria-describedby="roster-file-hint"
              onChange={(event) => setFile(event.target.files?.[0] ?? null)}
              className="block w-full min-w-0 rounded-lg border border-line-strong bg-surface px-3 py-2 text-sm file:mr-3 file:rounded-md file:border-0 file:bg-accent-soft file:px-3 file:py-1.5 file:text-sm file:font-semibold file:text-accent-strong sm:w-auto sm:flex-1"
            />
            <button type="submit" disabled={pending || !file} className={buttonClass("secondary")}>
              {pending && intent === "preview" ? "Checking…" : "Check the file"}
            </button>
          </div>
          <p id="roster-file-hint" className="text-sm text-ink-faint">
            Up to {rosterFileLimitLabel}; about 5,000 learners take 250 kB.
          </p>
        </form>
      )}

      <StatusNotice
        tone={imported ? "success" : "error"}
        message={localProblem ?? (state.status === "problem" ? state.message : imported ? imported.message : null)}
      />
      {imported?.warning ? <StatusNotice tone="warning" message={imported.warning} /> : null}
      {imported ? (
        <div className="flex flex-wrap gap-3">
          <Link href={`/admin/cohorts/${cohortId}?notice=imported`} className={buttonClass("primary")}>
            See the learners of {cohortName}
          </Link>
          <button type="button" onClick={onRestart} className={buttonClass("secondary")}>
            Import another file
          </button>
        </div>
      ) : null}

      {preview && !imported ? (
        <section aria-labelledby="preview-heading" className="space-y-4">
          <div>
            <h2 id="preview-heading" className="text-lg font-semibold">
              Preview of {preview.fileName}
            </h2>
            <p className="mt-1 text-sm text-ink-soft">
              {count(preview.counts.total)} rows: {count(preview.counts.valid)} valid, {count(preview.counts.duplicate)} duplicate,{" "}
              {count(preview.counts.invalid)} invalid.
              Nothing has been written yet. Only valid rows are imported; fix the others in your file and import it again later.
            </p>
          </div>
          <div className="flex flex-wrap items-center gap-3 rounded-lg bg-sunken p-3">
            <button type="button" disabled={pending || validCount === 0} onClick={() => send("import", validCount)} className={buttonClass("primary")}>
              {pending && intent === "import"
                ? `Importing and sending ${count(validCount)} invitations…`
                : `Import ${count(validCount)} valid row${validCount === 1 ? "" : "s"}`}
            </button>
            <p className="text-sm text-ink-soft">
              All valid rows go in together or none does. Each new learner gets an invitation e-mail{validCount > 1000 ? "; a list this long takes a minute or so" : ""}.
            </p>
          </div>
          <RosterPreviewTable key={`${preview.fileName}-${preview.counts.total}-${validCount}`} rows={preview.rows} counts={preview.counts} />
        </section>
      ) : null}
    </div>
  );
}
