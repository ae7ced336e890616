type Shape = "page" | "list" | "form";

const bar = "rounded bg-silt-200";

/**
 * The grey outline of a page while its data loads (a route's loading.tsx). It is a status region that says
 * "Loading" once to screen readers; the shapes themselves are hidden from them.
 */
export function PageSkeleton({ shape = "page", label = "Loading…" }: { shape?: Shape; label?: string }) {
  return (
    <div role="status" className="mx-auto w-full max-w-6xl px-4 py-10" data-testid="page-skeleton">
      <span className="sr-only">{label}</span>
      <div aria-hidden="true" className="animate-pulse">
        <div className={`h-8 w-2/3 max-w-md ${bar}`} />
        <div className={`mt-3 h-4 w-1/2 max-w-sm ${bar}`} />
        {shape === "list" ? (
          <div className="mt-8 space-y-3">
            {[0, 1, 2, 3].map((k) => (
              <div key={k} className="flex items-center gap-4 rounded-card border border-silt-200 bg-white p-4">
                <div className={`h-10 w-10 shrink-0 rounded-full bg-silt-200`} />
                <div className="flex-1 space-y-2">
                  <div className={`h-4 w-1/3 ${bar}`} />
                  <div className={`h-3 w-2/3 ${bar}`} />
                </div>
              </div>
            ))}
          </div>
        ) : shape === "form" ? (
          <div className="mt-8 max-w-xl space-y-5 rounded-card border border-silt-200 bg-white p-5">
            {[0, 1, 2].map((k) => (
              <div key={k} className="space-y-2">
                <div className={`h-3 w-1/4 ${bar}`} />
                <div className="h-11 rounded-lg bg-silt-100" />
              </div>
            ))}
            <div className="h-11 w-32 rounded-lg bg-silt-200" />
          </div>
        ) : (
          <div className="mt-8 grid gap-4 sm:grid-cols-2">
            <div className="h-32 rounded-card bg-silt-200" />
            <div className="h-32 rounded-card bg-silt-200" />
          </div>
        )}
      </div>
    </div>
  );
}
