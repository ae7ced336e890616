"use client";
import { useEffect } from "react";
import { Button } from "@/components/ui/button";

export function ErrorState({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <div className="mx-auto max-w-xl px-4 py-16 text-center">
      <h1 className="text-2xl font-semibold text-silt-950">Something went wrong</h1>
      <p className="mt-2 text-silt-700">Nothing you entered was lost on our side. Try again; if it keeps happening, come back in a few minutes.</p>
      {error.digest ? <p className="mt-2 text-xs text-silt-500">Reference: {error.digest}</p> : null}
      <div className="mt-6">
        <Button onClick={reset}>Try again</Button>
      </div>
    </div>
  );
}
