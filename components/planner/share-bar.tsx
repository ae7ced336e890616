/** One horizontal bar of stacked parts, as SVG so that its colours print (browsers drop CSS backgrounds when printing). */
export function ShareBar({ parts, scale, label }: { parts: { value: number; className: string }[]; scale: number; label?: string }) {
  let at = 0;
  return (
    <svg viewBox="0 0 100 4" preserveAspectRatio="none" className="h-3 w-full" role={label ? "img" : undefined} aria-label={label} aria-hidden={label ? undefined : true}>
      <rect x={0} y={0} width={100} height={4} className="fill-silt-100" />
      {parts.map((p, i) => {
        const w = scale > 0 ? (Math.max(0, p.value) / scale) * 100 : 0;
        const rect = <rect key={i} x={at} y={0} width={w} height={4} className={p.className} />;
        at += w;
        return rect;
      })}
    </svg>
  );
}
