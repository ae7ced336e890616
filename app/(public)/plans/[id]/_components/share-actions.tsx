"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";

/** Print and copy-link buttons: the only JavaScript a saved plan's page needs. */
export function ShareActions({ path }: { path: string }) {
  const [status, setStatus] = useState<string | null>(null);
  async function copy() {
    const url = `${window.location.origin}${path}`;
    try {
      await navigator.clipboard.writeText(url);
      setStatus("Link copied.");
    } catch (error) {
      console.warn("[plan] clipboard refused", error);
      setStatus(`Copy this link: ${url}`);
    }
  }
  return (
    <>
      <Button type="button" onClick={() => window.print()}>
        Print
      </Button>
      <Button type="button" variant="secondary" onClick={() => void copy()}>
        Copy link
      </Button>
      {status ? (
        <p role="status" className="w-full text-sm text-silt-700">
          {status}
        </p>
      ) : null}
    </>
  );
}
