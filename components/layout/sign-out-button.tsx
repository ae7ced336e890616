"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";

/**
 * Signs out through the auth API directly: the header is on every page, and the auth
 * client library would add its weight to every page's JavaScript.
 */
export function SignOutButton() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      disabled={busy}
      onClick={async () => {
        setBusy(true);
        await fetch("/api/auth/sign-out", { method: "POST", headers: { "content-type": "application/json" }, body: "{}" }).catch(() => undefined);
        router.push("/");
        router.refresh();
      }}
      className="min-h-11 rounded-lg px-3 text-sm font-medium text-silt-700 hover:bg-silt-100"
    >
      {busy ? "Signing out…" : "Sign out"}
    </button>
  );
}
