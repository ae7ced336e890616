import { num } from "./format";

/*
 * A small week-by-week chart drawn as SVG: no chart library, so the planner stays light on slow phone connections
 * (recharts alone is about 140 KB gzipped). Server-renderable: no state, no effects.
 */

export interface TimeChartProps {
  title: string;
  unit: string;
  /** One value per week, week 0 first. */
  values: readonly number[];
  kind: "area" | "bars";
  testId: string;
}

const W = 400;
const H = 180;
const M = { top: 12, right: 12, bottom: 30, left: 46 };
const PLOT_W = W - M.left - M.right;
const PLOT_H = H - M.top - M.bottom;

/** A step of 1, 2 or 5 × 10ⁿ giving about `count` intervals up to `max`. */
export function niceStep(max: number, count: number): number {
  if (!(max > 0)) return 1;
  const raw = max / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const scaled = raw / power;
  const nice = scaled <= 1 ? 1 : scaled <= 2 ? 2 : scaled <= 5 ? 5 : 10;
  return nice * power;
}

/** Ticks from 0 to the first step at or above `max`, so the axis always covers the data. */
function ticks(max: number, count: number): number[] {
  const step = niceStep(max, count);
  const top = Math.max(step, Math.ceil(max / step - 1e-9) * step);
  const out: number[] = [];
  for (let i = 0; i * step <= top + step * 1e-9; i += 1) out.push(Number((i * step).toPrecision(12)));
  return out;
}

export function TimeChart({ title, unit, values, kind, testId }: TimeChartProps) {
  const weeks = Math.max(1, values.length - 1);
  const peak = Math.max(0, ...values);
  const yTicks = ticks(peak, 4);
  const yMax = yTicks.at(-1) ?? 1;
  const xStep = Math.max(1, niceStep(weeks, 6));
  const xTicks = Array.from({ length: Math.floor(weeks / xStep) + 1 }, (_, i) => i * xStep);
  const x = (week: number) => M.left + (week / weeks) * PLOT_W;
  const y = (v: number) => M.top + PLOT_H - (yMax > 0 ? (v / yMax) * PLOT_H : 0);
  const last = values.at(-1) ?? 0;
  const label =
    kind === "area"
      ? `${title}: ${num(values[0] ?? 0, 1)} ${unit} at stocking, ${num(peak, 1)} ${unit} at most, ${num(last, 1)} ${unit} in week ${values.length - 1}.`
      : `${title}: up to ${num(peak, 1)} ${unit} a week, ${num(values.reduce((a, b) => a + b, 0), 0)} ${unit} in all over ${values.length - 1} weeks.`;

  const line = values.map((v, i) => `${i === 0 ? "M" : "L"}${x(i).toFixed(1)},${y(v).toFixed(1)}`).join("");
  const area = `${line}L${x(values.length - 1).toFixed(1)},${y(0).toFixed(1)}L${x(0).toFixed(1)},${y(0).toFixed(1)}Z`;
  const barW = Math.max(1, (PLOT_W / (weeks + 1)) * 0.7);

  return (
    <figure className="break-inside-avoid">
      <figcaption className="text-sm font-semibold text-silt-800">
        {title} <span className="font-normal text-silt-600">({unit})</span>
      </figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="mt-1 w-full max-w-xl" role="img" aria-label={label} data-testid={testId} data-peak={peak.toFixed(3)} data-last={last.toFixed(3)} data-weeks={values.length - 1}>
        {yTicks.map((t) => (
          <g key={`y${t}`}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} className="stroke-silt-200" strokeWidth={1} />
            <text x={M.left - 6} y={y(t) + 4} textAnchor="end" className="fill-silt-600" fontSize={12}>
              {num(t, 1)}
            </text>
          </g>
        ))}
        {xTicks.map((t) => (
          <text key={`x${t}`} x={x(t)} y={H - M.bottom + 16} textAnchor="middle" className="fill-silt-600" fontSize={12}>
            {t}
          </text>
        ))}
        <text x={M.left + PLOT_W / 2} y={H - 2} textAnchor="middle" className="fill-silt-600" fontSize={12}>
          week
        </text>
        {kind === "area" ? (
          <>
            <path d={area} className="fill-lagoon-100" />
            <path d={line} className="stroke-lagoon-600" fill="none" strokeWidth={2.5} strokeLinejoin="round" />
          </>
        ) : (
          values.map((v, i) =>
            i === 0 ? null : <rect key={i} x={x(i) - barW / 2} y={y(v)} width={barW} height={Math.max(0, y(0) - y(v))} className="fill-reed-400" />,
          )
        )}
        <line x1={M.left} x2={W - M.right} y1={y(0)} y2={y(0)} className="stroke-silt-400" strokeWidth={1} />
      </svg>
    </figure>
  );
}
