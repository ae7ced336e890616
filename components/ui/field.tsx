import type { ComponentProps, ReactNode } from "react";

// The border (silt-400, 3:1 on white) shows where a box is (WCAG 2.2 SC 1.4.11); placeholders are silt-500 so hint
// text stays readable (4.5:1) yet lighter than typed text. Focus shows the app's one ring (app/globals.css).
export const inputClass =
  "block w-full rounded-lg border border-silt-400 bg-white px-3 py-2.5 text-base text-silt-900 placeholder:text-silt-500 focus:border-lagoon-600 aria-[invalid=true]:border-clay-500";

type FieldProps = { id: string; label: string; hint?: ReactNode; error?: string; children: ReactNode };

/** A labelled control with its hint and error, tied together for screen readers. */
export function Field({ id, label, hint, error, children }: FieldProps) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-sm font-medium text-silt-800">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-silt-600">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-sm font-medium text-clay-600">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export function describedBy(id: string, error?: string, hint?: boolean): string | undefined {
  if (error) return `${id}-error`;
  return hint ? `${id}-hint` : undefined;
}

export function Input({ className = "", ...props }: ComponentProps<"input">) {
  return <input className={`${inputClass} ${className}`} {...props} />;
}

export function FormError({ message }: { message?: string | null }) {
  if (!message) return null;
  return (
    <div role="alert" className="rounded-lg border border-clay-500/30 bg-clay-50 px-3 py-2.5 text-sm text-clay-700">
      {message}
    </div>
  );
}

export function FormNotice({ children }: { children: ReactNode }) {
  return <div role="status" className="rounded-lg border border-lagoon-200 bg-lagoon-50 px-3 py-2.5 text-sm text-lagoon-800">{children}</div>;
}
