"use client";
import { useEffect, useRef, useState, type KeyboardEvent } from "react";

/**
 * An inline "are you sure?" step that replaces the button that asked (accept a quote, close a request…), with the
 * focus handling of a small dialog: the confirming button takes focus when the step opens, Escape backs out, and
 * focus returns to the button that opened it — without this the focused button unmounts and focus falls to the page.
 */
export function useConfirmStep() {
  const [asking, setAsking] = useState(false);
  const triggerRef = useRef<HTMLButtonElement>(null);
  const confirmRef = useRef<HTMLButtonElement>(null);
  const opened = useRef(false);

  useEffect(() => {
    if (asking) {
      opened.current = true;
      confirmRef.current?.focus();
    } else if (opened.current) {
      opened.current = false;
      triggerRef.current?.focus();
    }
  }, [asking]);

  return {
    asking,
    ask: () => setAsking(true),
    cancel: () => setAsking(false),
    triggerRef,
    confirmRef,
    /** on the step's container: Escape backs out */
    onKeyDown: (event: KeyboardEvent<HTMLElement>) => {
      if (event.key !== "Escape") return;
      event.preventDefault();
      setAsking(false);
    },
  };
}
