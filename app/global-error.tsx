"use client";

// Replaces the root layout when it fails itself, so it brings its own <html> and plain styles.
export default function GlobalError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: "system-ui, sans-serif", maxWidth: "32rem", margin: "4rem auto", padding: "0 1rem", lineHeight: 1.5 }}>
        <h1>Restpoint is having trouble</h1>
        <p>The page could not be shown. The error was logged{error.digest === undefined ? "" : ` (${error.digest})`}.</p>
        <button type="button" onClick={reset}>
          Try again
        </button>
      </body>
    </html>
  );
}
