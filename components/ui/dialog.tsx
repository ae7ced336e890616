"use client";
import { useEffect, useId, useRef, type ReactNode, type RefObject } from "react";

type Props = {
  open: boolean;
  /** called however the dialog closes: Escape, the close button, or the caller setting `open` false */
  onClose: () => void;
  title: string;
  /** where focus goes back to once the dialog closes (usually the button that opened it) */
  returnFocusTo: RefObject<HTMLElement | null>;
  children: ReactNode;
};

const FOCUSABLE = 'a[href], button:not([disabled]), input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';

/**
 * A modal on the native <dialog>: showModal() makes the rest of the page inert and Escape closes it (HTML Standard,
 * "the dialog element"); Tab is also kept inside, wrapping at the ends, and focus returns to the opener on close.
 * Focus starts on the element marked `data-autofocus`, if any.
 * Labelled by its title. No library: the browser does most of the work.
 */
export function Dialog({ open, onClose, title, returnFocusTo, children }: Props) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const latestClose = useRef(onClose);
  useEffect(() => {
    latestClose.current = onClose;
  });

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      dialog.showModal();
      // showModal focuses the first focusable element (the close button); the first field is more useful.
      dialog.querySelector<HTMLElement>("[data-autofocus]")?.focus();
    }
    if (!open && dialog.open) dialog.close();
  }, [open]);

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    const closed = () => {
      latestClose.current();
      returnFocusTo.current?.focus();
    };
    dialog.addEventListener("close", closed);
    return () => dialog.removeEventListener("close", closed);
  }, [returnFocusTo]);

  function keepTabInside(event: React.KeyboardEvent<HTMLDialogElement>) {
    if (event.key !== "Tab" || !ref.current) return;
    const items = Array.from(ref.current.querySelectorAll<HTMLElement>(FOCUSABLE)).filter((el) => el.offsetParent !== null || el === document.activeElement);
    const firstItem = items[0];
    const lastItem = items.at(-1);
    if (!firstItem || !lastItem) return;
    if (event.shiftKey && document.activeElement === firstItem) {
      event.preventDefault();
      lastItem.focus();
    } else if (!event.shiftKey && document.activeElement === lastItem) {
      event.preventDefault();
      firstItem.focus();
    }
  }

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onKeyDown={keepTabInside}
      className="m-auto w-[calc(100%-2rem)] max-w-md rounded-card border border-silt-200 bg-white p-0 text-silt-900 shadow-card backdrop:bg-silt-950/50"
    >
      {open ? (
        <div className="space-y-4 p-5">
          <div className="flex items-start justify-between gap-3">
            <h2 id={titleId} className="text-lg font-semibold text-silt-950">
              {title}
            </h2>
            <button type="button" onClick={() => ref.current?.close()} className="-m-2 flex h-11 w-11 shrink-0 items-center justify-center rounded-lg text-silt-700 hover:bg-silt-100" aria-label="Close">
              <svg viewBox="0 0 16 16" className="h-4 w-4" aria-hidden="true" focusable="false">
                <path d="M3 3l10 10M13 3L3 13" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
              </svg>
            </button>
          </div>
          {children}
        </div>
      ) : null}
    </dialog>
  );
}
