"use client";

import { ErrorPanel } from "@/components/ui/error-panel";

export default function AuthError({ error, retry }: { error: unknown; retry: () => void }) {
  return <ErrorPanel error={error} retry={retry} what="this page" />;
}
