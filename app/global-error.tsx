"use client";

export default function GlobalError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: "system-ui, sans-serif", padding: 32, background: "#f4f5f4", color: "#0e1110" }}>
        <h1>Gusset could not load</h1>
        <p>Something failed on our side. Nothing you had already signed is affected.</p>
        <button type="button" onClick={reset} style={{ minHeight: 48, padding: "0 16px" }}>Try again</button>
      </body>
    </html>
  );
}
