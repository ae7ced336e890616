export const STAR_PATH = "M10 1.5l2.6 5.4 5.9.8-4.3 4.1 1 5.9L10 14.9l-5.2 2.8 1-5.9L1.5 7.7l5.9-.8z";

function Star({ className }: { className: string }) {
  return (
    <svg viewBox="0 0 20 20" className={className} aria-hidden="true" focusable="false">
      <path d={STAR_PATH} />
    </svg>
  );
}

const SIZES = { sm: "h-3.5 w-3.5", md: "h-5 w-5", lg: "h-7 w-7" } as const;

/**
 * Five stars filled to `value` (fractions allowed), drawn only: the caller gives the words ("4 of 5 stars"),
 * because a screen reader should hear the number once, not five images.
 */
export function StarRow({ value, size = "sm" }: { value: number; size?: keyof typeof SIZES }) {
  const share = Math.max(0, Math.min(5, value)) / 5;
  const cls = `${SIZES[size]} shrink-0`;
  return (
    <span className="relative inline-flex" aria-hidden="true">
      <span className="flex text-silt-300">
        {[0, 1, 2, 3, 4].map((i) => (
          <Star key={i} className={`${cls} fill-current`} />
        ))}
      </span>
      <span className="absolute inset-y-0 left-0 flex overflow-hidden text-reed-500" style={{ width: `${share * 100}%` }}>
        {[0, 1, 2, 3, 4].map((i) => (
          <Star key={i} className={`${cls} fill-current`} />
        ))}
      </span>
    </span>
  );
}

/** Whole stars with their words, e.g. for one review: "4 of 5 stars". */
export function Stars({ value, size = "sm", label }: { value: number; size?: keyof typeof SIZES; label?: string }) {
  return (
    <span className="inline-flex items-center gap-1.5">
      <StarRow value={value} size={size} />
      <span className="sr-only">{label ?? `${value} of 5 stars`}</span>
    </span>
  );
}

