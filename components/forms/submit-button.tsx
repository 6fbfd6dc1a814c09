import { buttonClass } from "@/components/ui/button-class";

/** Disabled while the action runs so a double click cannot submit twice. */
export function SubmitButton({
  pending,
  children,
  pendingLabel,
  wide = true,
}: {
  pending: boolean;
  children: React.ReactNode;
  pendingLabel: string;
  wide?: boolean;
}) {
  return (
    <button type="submit" disabled={pending} aria-disabled={pending} className={buttonClass("primary", wide ? "w-full" : "")}>
      {pending ? pendingLabel : children}
    </button>
  );
}
