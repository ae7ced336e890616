"use client";
import dynamic from "next/dynamic";
import { useRef, useState } from "react";

// The dialog and its form library load on the first press (or when a finger or the focus comes near the button),
// not with the page: most visitors never report anything, and the page must stay light on a slow phone link.
const loadDialog = () => import("@/components/reviews/report-dialog").then((m) => m.ReportDialog);
const ReportDialog = dynamic(loadDialog, {
  ssr: false,
  loading: () => (
    <span role="status" className="text-sm text-silt-600">
      Opening…
    </span>
  ),
});

/** "Report" for one review, and what it became once reported. */
export function ReportReview({ reviewId, authorName, alreadyReported }: { reviewId: string; authorName: string; alreadyReported: boolean }) {
  const [wanted, setWanted] = useState(false);
  const [open, setOpen] = useState(false);
  const [done, setDone] = useState(alreadyReported);
  const opener = useRef<HTMLElement | null>(null);
  const preload = () => void loadDialog();

  return (
    <>
      {done ? (
        // Focus lands here when the dialog closes after sending, so keyboard and screen reader users hear the outcome.
        <p ref={(el) => { opener.current = el; }} tabIndex={-1} className="inline-flex min-h-11 items-center text-sm text-silt-600" role="status">
          Reported: a Shoal moderator will read it.
        </p>
      ) : (
        <button
          ref={(el) => { opener.current = el; }}
          type="button"
          onClick={() => { setWanted(true); setOpen(true); }}
          onPointerEnter={preload}
          onFocus={preload}
          aria-haspopup="dialog"
          className="inline-flex min-h-11 items-center rounded-lg px-3 text-sm font-medium text-silt-700 underline underline-offset-2 hover:bg-silt-100"
        >
          Report<span className="sr-only"> the review by {authorName}</span>
        </button>
      )}
      {wanted ? (
        <ReportDialog
          reviewId={reviewId}
          authorName={authorName}
          open={open}
          onClose={() => setOpen(false)}
          onReported={() => { setDone(true); setOpen(false); }}
          returnFocusTo={opener}
        />
      ) : null}
    </>
  );
}
