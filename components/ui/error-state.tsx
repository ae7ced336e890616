"use client";
import { useEffect, useRef, useSyncExternalStore } from "react";
import { Button } from "@/components/ui/button";
import { subscribeOnline, isOnline, serverIsOnline } from "@/components/layout/online-status";

type Props = {
  error: Error & { digest?: string };
  /** clears the boundary and renders its children again, from what the browser already has */
  reset: () => void;
  /** Next.js (16) also passes this: fetches the segment from the server again, then resets — a real retry */
  retry?: () => void;
};

/** What a route's error.tsx shows: what happened in plain words, and a retry that asks the server again. */
export function ErrorState({ error, reset, retry }: Props) {
  const online = useSyncExternalStore(subscribeOnline, isOnline, serverIsOnline);
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    console.error(error);
  }, [error]);
  // Focus moves to the message so keyboard and screen-reader users learn the page did not load.
  useEffect(() => {
    heading.current?.focus();
  }, []);
  return (
    <div className="mx-auto max-w-xl px-4 py-16 text-center" role="alert">
      <h1 ref={heading} tabIndex={-1} className="text-2xl font-semibold text-silt-950 focus:outline-none">
        {online ? "Something went wrong" : "You are offline"}
      </h1>
      <p className="mt-2 text-silt-700">
        {online
          ? "Nothing you entered was lost on our side. Try again; if it keeps happening, come back in a few minutes."
          : "This page needs a connection to load. Check your mobile data or Wi-Fi, then try again."}
      </p>
      {error.digest ? <p className="mt-2 text-xs text-silt-600">Reference: {error.digest}</p> : null}
      <div className="mt-6">
        <Button onClick={retry ?? reset}>Try again</Button>
      </div>
    </div>
  );
}
