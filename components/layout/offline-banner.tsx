"use client";
import { useEffect, useRef, useState, useSyncExternalStore } from "react";
import { isOnline, serverIsOnline, subscribeOnline } from "./online-status";

const BACK_ONLINE_MS = 4000;

/**
 * A strip at the top of every page while the browser is offline, and a short "back online" after. A polite live
 * region, so a screen reader says it without interrupting. Lists fetched with TanStack Query pause while offline and
 * refetch on their own when the connection returns (its onlineManager listens to the same events).
 */
export function OfflineBanner() {
  const online = useSyncExternalStore(subscribeOnline, isOnline, serverIsOnline);
  const [backOnline, setBackOnline] = useState(false);
  const wasOffline = useRef(false);

  useEffect(() => {
    if (!online) {
      wasOffline.current = true;
      setBackOnline(false);
      return;
    }
    if (!wasOffline.current) return;
    wasOffline.current = false;
    setBackOnline(true);
    const t = setTimeout(() => setBackOnline(false), BACK_ONLINE_MS);
    return () => clearTimeout(t);
  }, [online]);

  return (
    // A live region that is always there (so the change is announced), without the status role: forms on the
    // page have their own status messages, and this one says nothing while the connection is fine.
    <div aria-live="polite" className="no-print sticky top-0 z-40" data-testid="offline-banner">
      {!online ? (
        <p className="border-b border-reed-300 bg-reed-100 px-4 py-2 text-center text-sm font-medium text-reed-900">
          You are offline. What you have typed stays on this page: send it once the connection is back.
        </p>
      ) : backOnline ? (
        <p className="border-b border-lagoon-200 bg-lagoon-50 px-4 py-2 text-center text-sm font-medium text-lagoon-800">Back online.</p>
      ) : null}
    </div>
  );
}
