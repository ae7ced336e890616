"use client";

export default function GlobalError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: "system-ui, sans-serif", padding: "3rem 1rem", textAlign: "center", color: "#26241f" }}>
        <h1>Shoal is having trouble</h1>
        <p>Please try again in a moment.</p>
        <button onClick={reset} style={{ padding: "0.7rem 1.2rem", background: "#176d64", color: "white", border: 0, borderRadius: 8 }}>
          Try again
        </button>
      </body>
    </html>
  );
}
