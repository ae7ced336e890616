import { ResponsiveImage } from "@/components/upload/responsive-image";
import type { ShownImage } from "@/lib/uploads/images";

/** A row of processed photos; each opens its largest variant. */
export function PhotoStrip({ photos, label, empty }: { photos: readonly ShownImage[]; label: string; empty?: string }) {
  if (photos.length === 0) return empty ? <p className="text-sm text-silt-600">{empty}</p> : null;
  return (
    <ul className="grid grid-cols-3 gap-2 sm:grid-cols-4" aria-label={label}>
      {photos.map((p, i) => (
        <li key={p.id}>
          <a href={`/api/images/${p.id}/${Math.max(...p.widths)}.webp`} className="block overflow-hidden rounded-lg border border-silt-200">
            <ResponsiveImage {...p} alt={p.alt || `${label} ${i + 1}`} sizes="(min-width: 640px) 25vw, 33vw" className="aspect-[4/3] w-full object-cover" />
          </a>
        </li>
      ))}
    </ul>
  );
}
