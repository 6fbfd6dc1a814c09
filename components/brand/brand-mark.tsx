import Link from "next/link";

export function BrandMark({ href = "/", size = "md" }: { href?: string; size?: "md" | "lg" }) {
  const box = size === "lg" ? "size-10" : "size-8";
  return (
    <Link href={href} className="inline-flex items-center gap-2.5 rounded-md text-ink no-underline">
      <svg viewBox="0 0 32 32" className={box} aria-hidden="true">
        <rect width="32" height="32" rx="7" className="fill-accent" />
        <path
          d="M5 21h5V10h6v11h4l2.5-3 2 2.2L27 17"
          fill="none"
          stroke="#ffffff"
          strokeWidth="2.6"
          strokeLinecap="round"
          strokeLinejoin="round"
        />
        <circle cx="27" cy="17" r="1.6" fill="#f0a56c" />
      </svg>
      <span className={size === "lg" ? "text-2xl font-semibold tracking-tight" : "text-lg font-semibold tracking-tight"}>
        Edgewise
      </span>
    </Link>
  );
}
