"use client";

import { ErrorPanel } from "@/components/ui/error-panel";

export default function TeachError({ error, retry }: { error: unknown; retry: () => void }) {
  return <ErrorPanel error={error} retry={retry} what="your cohorts" />;
}
