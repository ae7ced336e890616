import Link from "next/link";

export function SiteFooter() {
  return (
    <footer className="no-print mt-16 border-t border-silt-200 bg-white">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-6 text-sm text-silt-600">
        <span>© Shoal — fish farming, started right.</span>
        <Link href="/safety" className="underline-offset-2 hover:underline">Safety around tanks and pumps</Link>
      </div>
    </footer>
  );
}
