"use client";
import { useState } from "react";
import { deleteJson, putJson } from "@/lib/api/client";

type Props = { reviewId: string; count: number; marked: boolean };

/**
 * "Helpful" as a toggle button (aria-pressed). The count changes at once and goes back if the server refuses, so a
 * slow link does not make people tap twice.
 */
export function HelpfulButton({ reviewId, count, marked }: Props) {
  const [state, setState] = useState({ count, marked });
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function toggle() {
    const before = state;
    const next = { count: state.count + (state.marked ? -1 : 1), marked: !state.marked };
    setState(next);
    setBusy(true);
    setError(null);
    const url = `/api/v1/reviews/${reviewId}/helpful`;
    const result = next.marked ? await putJson<{ helpfulCount: number; markedHelpful: boolean }>(url, {}) : await deleteJson<{ helpfulCount: number; markedHelpful: boolean }>(url);
    setBusy(false);
    if (result.ok) return setState({ count: result.data.helpfulCount, marked: result.data.markedHelpful });
    setState(before);
    setError(result.message);
  }

  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <button
        type="button"
        aria-pressed={state.marked}
        disabled={busy}
        onClick={toggle}
        className="inline-flex min-h-11 items-center gap-1.5 rounded-lg border border-silt-300 bg-white px-3 text-sm font-medium text-silt-800 hover:bg-silt-100 aria-pressed:border-lagoon-600 aria-pressed:bg-lagoon-50 aria-pressed:text-lagoon-800 disabled:opacity-70"
      >
        <svg viewBox="0 0 20 20" className="h-4 w-4" aria-hidden="true" focusable="false">
          <path d="M7 9V17H4V9Zm2 8V9l3.5-6c1.2 0 2 .9 1.8 2.1L13.7 8H17a1.5 1.5 0 0 1 1.5 1.8l-1.3 6A1.5 1.5 0 0 1 15.7 17Z" fill={state.marked ? "currentColor" : "none"} stroke="currentColor" strokeWidth="1.5" strokeLinejoin="round" />
        </svg>
        Helpful
        <span className="tabular-nums" data-testid="helpful-count">
          {state.count > 0 ? `(${state.count})` : ""}
        </span>
      </button>
      {error ? (
        <span role="alert" className="text-sm text-clay-600">
          {error}
        </span>
      ) : null}
    </span>
  );
}
