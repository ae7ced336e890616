"use client";
import dynamic from "next/dynamic";
import { useRef, useState } from "react";
import { Button } from "@/components/ui/button";

// The form (and its form library) loads when the provider asks for it, not with every visitor's page.
const loadFields = () => import("@/components/reviews/reply-form-fields").then((m) => m.ReplyFormFields);
const ReplyFormFields = dynamic(loadFields, {
  ssr: false,
  loading: () => (
    <p role="status" className="text-sm text-silt-600">
      Opening the reply form…
    </p>
  ),
});

/** "Reply in public" for the reviewed provider. Folded behind a button so a page of reviews is not a page of empty boxes. */
export function ReplyForm({ reviewId, authorName }: { reviewId: string; authorName: string }) {
  const [open, setOpen] = useState(false);
  const button = useRef<HTMLButtonElement>(null);
  const preload = () => void loadFields();
  if (open) {
    return (
      <ReplyFormFields
        reviewId={reviewId}
        authorName={authorName}
        onCancel={() => {
          setOpen(false);
          // The button comes back in the next render; put focus on it so the keyboard user is not lost.
          requestAnimationFrame(() => button.current?.focus());
        }}
      />
    );
  }
  return (
    <Button ref={button} type="button" variant="secondary" onClick={() => setOpen(true)} onPointerEnter={preload} onFocus={preload}>
      Reply in public<span className="sr-only"> to {authorName}</span>
    </Button>
  );
}
