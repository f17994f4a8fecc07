import { SCHEME_STYLES } from '../../lib/scheme-style';
import { VERDICT_LABELS } from '../../lib/verdict';
import type { BriefChartBar } from '../../schemas/brief-content';

const W = 640;
const ROW = 30;
const LEFT = 132;
const RIGHT = 96;
const TOP = 22;

const niceStep = (maxV: number): number => {
  const raw = maxV / 5;
  const pow = 10 ** Math.floor(Math.log10(raw));
  return [1, 2, 2.5, 5, 10].map((m) => m * pow).find((s) => s >= raw) ?? raw;
};

/**
 * Primary switch stress (bar) against the chosen switch rating (tick) per scheme, as inline
 * SVG so it prints exactly as it shows (no canvas, no script).
 */
export default function StressChart({ bars }: { bars: BriefChartBar[] }) {
  const maxV = Math.max(1, ...bars.map((b) => Math.max(b.stressV, b.ratingV ?? 0)));
  const step = niceStep(maxV);
  const top = Math.ceil((maxV * 1.05) / step) * step;
  const plotW = W - LEFT - RIGHT;
  const x = (v: number): number => LEFT + (v / top) * plotW;
  const h = TOP + bars.length * ROW + 26;
  const ticks = Array.from({ length: Math.round(top / step) + 1 }, (_, i) => i * step);
  return (
    <figure className="brief-figure" data-brief-chart>
      <p className="mb-1 text-xs font-semibold text-muted">Primary switch voltage stress and rating, per scheme</p>
      <svg viewBox={`0 0 ${W} ${h}`} width="100%" role="img" aria-label="Primary switch voltage stress and chosen rating per scheme" className="block max-w-[640px]">
        {ticks.map((t) => (
          <g key={t}>
            <line x1={x(t)} x2={x(t)} y1={TOP - 6} y2={h - 22} stroke="#d9ddd8" strokeWidth="1" />
            <text x={x(t)} y={h - 8} fontSize="11" textAnchor="middle" fill="#5c6761">{t} V</text>
          </g>
        ))}
        {bars.map((b, i) => {
          const y = TOP + i * ROW;
          const style = SCHEME_STYLES[b.scheme];
          return (
            <g key={b.scheme}>
              <text x={LEFT - 8} y={y + 15} fontSize="12" textAnchor="end" fill="#1e2622">{b.label}</text>
              <rect x={LEFT} y={y + 4} width={Math.max(1, x(b.stressV) - LEFT)} height={16} fill={style.color} opacity={b.verdict === 'not-feasible' ? 0.45 : 0.9} />
              {b.ratingV !== null && (
                <line x1={x(b.ratingV)} x2={x(b.ratingV)} y1={y} y2={y + 24} stroke="#1e2622" strokeWidth="2.5" />
              )}
              <text x={W - RIGHT + 8} y={y + 15} fontSize="11" fill="#1e2622">
                {Math.round(b.stressV)} V{b.ratingV !== null ? ` / ${b.ratingV} V` : ' / none'}
              </text>
              <title>{`${b.label}: stress ${b.stressV.toFixed(1)} V, rating ${b.ratingV ?? 'none'} V, ${VERDICT_LABELS[b.verdict]}`}</title>
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-1 text-xs text-muted">
        Bars: worst-case primary switch voltage stress per scheme (faded when not feasible). Black tick: voltage rating of the switch the
        estimate uses. Right: stress / rating.
      </figcaption>
    </figure>
  );
}
