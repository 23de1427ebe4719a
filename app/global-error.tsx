"use client";

// Shown when the root layout itself fails; it must render its own <html>.
export default function GlobalError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: "sans-serif", padding: 32, background: "#FBFAF7", color: "#1C1B19" }}>
        <h1>Fluxyard is not available right now</h1>
        <p>Something failed while loading the site. Try again in a moment.</p>
        <button type="button" onClick={reset}>
          Try again
        </button>
      </body>
    </html>
  );
}
