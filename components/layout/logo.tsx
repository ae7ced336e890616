/** Shoal's mark: three fish-shaped arcs swimming together. Drawn inline so it costs no request. */
export function Logo({ className = "h-8 w-8" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect width="32" height="32" rx="9" fill="#176d64" />
      <path d="M6 12c3-3 7-3 10 0-3 3-7 3-10 0Zm10 0 3-2v4z" fill="#f2d08f" />
      <path d="M11 19c3-3 7-3 10 0-3 3-7 3-10 0Zm10 0 3-2v4z" fill="#d3eee9" />
      <path d="M5 24.5c2.4-2.2 5.6-2.2 8 0-2.4 2.2-5.6 2.2-8 0Zm8 0 2.4-1.6v3.2z" fill="#a7dcd3" />
    </svg>
  );
}
