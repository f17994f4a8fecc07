import { memo } from 'react';
import { sameData } from './stable';
import type { LegendEntry } from './types';

/** Marker shape in SVG, matching Chart.js point styles of the same name. */
function Marker({ shape, color, cx, cy, r = 3.5 }: { shape: LegendEntry['marker']; color: string; cx: number; cy: number; r?: number }) {
  switch (shape) {
    case 'circle':
      return <circle cx={cx} cy={cy} r={r} fill={color} />;
    case 'triangle':
      return <polygon points={`${cx},${cy - r * 1.15} ${cx + r * 1.1},${cy + r * 0.8} ${cx - r * 1.1},${cy + r * 0.8}`} fill={color} />;
    case 'rect':
      return <rect x={cx - r * 0.9} y={cy - r * 0.9} width={r * 1.8} height={r * 1.8} fill={color} />;
    case 'rectRot':
      return <polygon points={`${cx},${cy - r * 1.25} ${cx + r * 1.25},${cy} ${cx},${cy + r * 1.25} ${cx - r * 1.25},${cy}`} fill={color} />;
    case 'star': {
      const d = r * 1.2;
      const e = d * 0.7071;
      return (
        <path d={`M${cx - d},${cy}H${cx + d}M${cx},${cy - d}V${cy + d}M${cx - e},${cy - e}L${cx + e},${cy + e}M${cx - e},${cy + e}L${cx + e},${cy - e}`} stroke={color} strokeWidth={1.5} />
      );
    }
    default:
      return null;
  }
}

/** A short line with the dataset's dash and a marker in the middle, for HTML legends and buttons. */
export function Swatch({ color, dash, marker, thin = false, width = 30 }: Pick<LegendEntry, 'color' | 'dash' | 'marker' | 'thin'> & { width?: number }) {
  return (
    <svg width={width} height={12} viewBox={`0 0 ${width} 12`} aria-hidden="true" className="shrink-0">
      <line x1={1} y1={6} x2={width - 1} y2={6} stroke={color} strokeWidth={thin ? 1.5 : 2} strokeDasharray={dash.length ? dash.join(' ') : undefined} />
      <Marker shape={marker} color={color} cx={width / 2} cy={6} />
    </svg>
  );
}

/**
 * Legend drawn in HTML above a line chart: swatch, name and an optional figure per entry.
 * Memoised on the entries' content: most edits leave a legend as it was.
 */
export const LineLegend = memo(function LineLegend({ entries, label = 'Legend' }: { entries: LegendEntry[]; label?: string }) {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs" aria-label={label}>
      {entries.map((e) => (
        <li key={e.key} className="flex items-center gap-1.5">
          <Swatch color={e.color} dash={e.dash} marker={e.marker} thin={e.thin} />
          <span className="text-ink">{e.label}</span>
          {e.detail && <span className="text-muted">· {e.detail}</span>}
        </li>
      ))}
    </ul>
  );
}, (prev, next) => prev.label === next.label && sameData(prev.entries, next.entries));
