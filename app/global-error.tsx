"use client";

// Replaces the root layout when the layout itself fails, so it cannot rely on the global
// stylesheet and carries its own few styles.
export default function GlobalError({ error, retry }: { error: unknown; retry: () => void }) {
  const digest = error instanceof Error && "digest" in error ? String(error.digest) : null;
  return (
    <html lang="en">
      <body style={{ margin: 0, fontFamily: "system-ui, sans-serif", background: "#f6f4ee", color: "#1c2529" }}>
        <title>Edgewise is having trouble</title>
        <main style={{ maxWidth: 560, margin: "0 auto", padding: "64px 20px" }}>
          <h1 style={{ fontSize: 28, margin: "0 0 12px" }}>Edgewise is having trouble</h1>
          <p style={{ lineHeight: 1.5, color: "#4a555c" }}>
            The page could not be shown. Try again in a moment.
            {digest ? ` If it keeps happening, quote reference ${digest} to your school's Edgewise admin.` : ""}
          </p>
          <button
            type="button"
            onClick={retry}
            style={{ marginTop: 16, padding: "10px 18px", border: 0, borderRadius: 8, background: "#1d5c63", color: "#fff", fontWeight: 600, fontSize: 15 }}
          >
            Try again
          </button>
        </main>
      </body>
    </html>
  );
}
