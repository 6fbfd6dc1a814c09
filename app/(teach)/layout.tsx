import { AppFrame } from "@/components/shell/app-frame";
import { getCurrentUser } from "@/lib/auth/current-user";

// The frame only shows who is signed in; each page runs its own role check, because a layout
// is not re-run on every navigation and so cannot be the guard.
export default async function TeachLayout({ children }: { children: React.ReactNode }) {
  return <AppFrame user={await getCurrentUser()}>{children}</AppFrame>;
}
