export function PageSkeleton() {
  return (
    <div className="mx-auto max-w-6xl animate-pulse px-4 py-10" aria-busy="true" aria-label="Loading">
      <div className="h-8 w-2/3 rounded bg-silt-200" />
      <div className="mt-4 h-4 w-1/2 rounded bg-silt-200" />
      <div className="mt-8 grid gap-4 sm:grid-cols-2">
        <div className="h-32 rounded-card bg-silt-200" />
        <div className="h-32 rounded-card bg-silt-200" />
      </div>
    </div>
  );
}
