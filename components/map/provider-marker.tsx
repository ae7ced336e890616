/** Distinct marks for the two kinds of provider: a fish for hatcheries, a tank for builders. */
export function ProviderMark({ kind, selected = false }: { kind: "hatchery" | "builder"; selected?: boolean }) {
  const ring = selected ? "ring-4 ring-reed-300" : "";
  if (kind === "hatchery") {
    return (
      <span className={`flex h-8 w-8 items-center justify-center rounded-full border-2 border-white bg-lagoon-600 shadow-card ${ring}`}>
        <svg viewBox="0 0 24 24" className="h-5 w-5" aria-hidden="true">
          <path d="M3 12c3.5-4 9.5-4 13 0-3.5 4-9.5 4-13 0Zm13 0 4.5-3v6z" fill="#fff" />
        </svg>
      </span>
    );
  }
  return (
    <span className={`flex h-8 w-8 items-center justify-center rounded-md border-2 border-white bg-reed-600 shadow-card ${ring}`}>
      <svg viewBox="0 0 24 24" className="h-5 w-5" aria-hidden="true">
        <path d="M4 8h16v9a1 1 0 0 1-1 1H5a1 1 0 0 1-1-1Z" fill="none" stroke="#fff" strokeWidth="2" />
        <path d="M6 13c2-1.5 4-1.5 6 0s4 1.5 6 0" fill="none" stroke="#fff" strokeWidth="1.6" />
      </svg>
    </span>
  );
}
