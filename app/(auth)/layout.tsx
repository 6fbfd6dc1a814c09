import { BrandMark } from "@/components/brand/brand-mark";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="mx-auto w-full max-w-md px-5 pt-10 sm:pt-16">
        <BrandMark />
      </header>
      <main className="mx-auto w-full max-w-md flex-1 px-5 py-8">{children}</main>
      <footer className="mx-auto w-full max-w-md px-5 pb-8 text-sm text-ink-faint">
        Accounts are created by your school. Trouble signing in? Ask your school&apos;s Edgewise admin.
      </footer>
    </div>
  );
}
