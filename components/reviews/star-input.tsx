"use client";
import { STAR_PATH } from "@/components/reviews/stars";

const WORDS = ["", "Poor", "Below what was agreed", "All right", "Good", "Excellent"] as const;

type Props = {
  /** the radios' shared name; also the base of their ids */
  name: string;
  legend: string;
  value: number | undefined;
  onChange: (stars: number) => void;
  onBlur?: () => void;
  error?: string;
  size?: "md" | "lg";
  /** react-hook-form's field ref, so a refused submit can move focus to this question */
  inputRef?: (element: HTMLInputElement | null) => void;
};

/**
 * 1–5 stars as a native radio group: Tab reaches the group, the arrow keys move the choice, and a screen reader
 * says "3 stars, All right, 3 of 5". Stars up to the choice are drawn filled; each radio lies transparent over its
 * star (so a tap or click lands on the radio itself), and the focused star gets the focus ring.
 */
export function StarInput({ name, legend, value, onChange, onBlur, error, size = "md", inputRef }: Props) {
  const box = size === "lg" ? "h-11 w-11" : "h-10 w-10";
  const errorId = `${name}-error`;
  return (
    // A fieldset in the radiogroup role may carry aria-invalid and aria-required (WAI-ARIA 1.2); the legend names it.
    <fieldset role="radiogroup" aria-labelledby={`${name}-legend`} aria-required="true" aria-describedby={error ? errorId : undefined} aria-invalid={error ? true : undefined} className="min-w-0">
      <legend id={`${name}-legend`} className="text-sm font-medium text-silt-800">
        {legend}
      </legend>
      <div className="mt-1 flex flex-wrap items-center gap-x-3 gap-y-1">
        <div className="flex">
          {[1, 2, 3, 4, 5].map((n) => {
            const id = `${name}-${n}`;
            const filled = value !== undefined && n <= value;
            return (
              <label key={n} htmlFor={id} className={`relative flex ${box} cursor-pointer items-center justify-center rounded-lg has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-offset-0 has-[:focus-visible]:outline-reed-500`}>
                <input
                  id={id}
                  ref={n === (value ?? 1) ? inputRef : undefined}
                  type="radio"
                  name={name}
                  value={n}
                  checked={value === n}
                  onChange={() => onChange(n)}
                  onBlur={onBlur}
                  className="absolute inset-0 z-10 m-0 h-full w-full cursor-pointer appearance-none opacity-0"
                />
                <span className="sr-only">
                  {n} {n === 1 ? "star" : "stars"}, {WORDS[n]}
                </span>
                <svg viewBox="0 0 20 20" className={`${size === "lg" ? "h-8 w-8" : "h-7 w-7"} ${filled ? "fill-reed-500 text-reed-600" : "fill-white text-silt-500"}`} aria-hidden="true" focusable="false">
                  <path d={STAR_PATH} stroke="currentColor" strokeWidth="1.2" strokeLinejoin="round" />
                </svg>
              </label>
            );
          })}
        </div>
        <span className="text-sm text-silt-700" aria-hidden="true">
          {value ? WORDS[value] : "Not rated yet"}
        </span>
      </div>
      {error ? (
        <p id={errorId} role="alert" className="mt-1 text-sm font-medium text-clay-600">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
