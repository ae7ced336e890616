// The browser's idea of whether it is online, as a store for useSyncExternalStore. `navigator.onLine` false is
// reliable (no network at all); true only means "some network", so requests still say when they fail.

export function subscribeOnline(onChange: () => void): () => void {
  window.addEventListener("online", onChange);
  window.addEventListener("offline", onChange);
  return () => {
    window.removeEventListener("online", onChange);
    window.removeEventListener("offline", onChange);
  };
}

export const isOnline = (): boolean => navigator.onLine;

/** The server renders as online: the banner only appears once the browser says otherwise. */
export const serverIsOnline = (): boolean => true;
