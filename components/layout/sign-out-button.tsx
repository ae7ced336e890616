"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { authClient } from "@/lib/auth/auth-client";

export function SignOutButton() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      disabled={busy}
      onClick={async () => {
        setBusy(true);
        await authClient.signOut();
        router.push("/");
        router.refresh();
      }}
      className="min-h-11 rounded-lg px-3 text-sm font-medium text-silt-700 hover:bg-silt-100"
    >
      {busy ? "Signing out…" : "Sign out"}
    </button>
  );
}
