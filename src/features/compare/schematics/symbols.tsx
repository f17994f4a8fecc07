/**
 * Small schematic symbols (IEC/IEEE style) for the reset-scheme drawings. Every symbol takes its
 * terminal coordinates in the drawing's user units and an optional highlight colour: with `hl`
 * set it is stroked in that colour and thicker, which is how the reset path is marked.
 */
import type { ReactNode } from 'react';

export const INK = '#3a4540';
export const WIRE_W = 1.5;
export const HL_W = 2.5;
export const FONT = 'Noto Sans, sans-serif';

export type Pt = readonly [number, number];
interface Stroke { hl?: string | undefined }

const stroke = (hl?: string) => ({ stroke: hl ?? INK, strokeWidth: hl ? HL_W : WIRE_W, fill: 'none' });

/** Poly-line wire through the given points. */
export function Wire({ pts, hl }: { pts: readonly Pt[] } & Stroke) {
  return <polyline points={pts.map((p) => p.join(',')).join(' ')} {...stroke(hl)} strokeLinejoin="round" />;
}

/** Vertical wire from y1 to y2 that hops (small arc) over a horizontal wire at hopY. */
export function HopWire({ x, y1, y2, hopY, hl }: { x: number; y1: number; y2: number; hopY: number } & Stroke) {
  const r = 3.5;
  const [a, b] = y1 < y2 ? [hopY - r, hopY + r] : [hopY + r, hopY - r];
  const sweep = y1 < y2 ? 0 : 1;
  return <path d={`M${x} ${y1} V${a} A${r} ${r} 0 0 ${sweep} ${x} ${b} V${y2}`} {...stroke(hl)} />;
}

export function Junction({ at, hl }: { at: Pt } & Stroke) {
  return <circle cx={at[0]} cy={at[1]} r={hl ? 2.6 : 2.2} fill={hl ?? INK} />;
}

/** Draws `children` (a body laid along +x, centred on 0) between two terminals, with leads. */
function Along({ from, to, half, hl, children }: { from: Pt; to: Pt; half: number; children: ReactNode } & Stroke) {
  const [x1, y1] = from;
  const [x2, y2] = to;
  const len = Math.hypot(x2 - x1, y2 - y1);
  const deg = (Math.atan2(y2 - y1, x2 - x1) * 180) / Math.PI;
  return (
    <g transform={`translate(${(x1 + x2) / 2} ${(y1 + y2) / 2}) rotate(${deg})`} {...stroke(hl)}>
      <path d={`M${-len / 2} 0 H${-half} M${half} 0 H${len / 2}`} />
      {children}
    </g>
  );
}

/** Diode from anode `from` to cathode `to`. */
export function Diode({ from, to, hl }: { from: Pt; to: Pt } & Stroke) {
  return (
    <Along from={from} to={to} half={5} hl={hl}>
      <path d="M-5 -5.5 L5 0 L-5 5.5 Z" fill={hl ?? INK} fillOpacity={0.12} strokeLinejoin="round" />
      <path d="M5 -5.5 V5.5" />
      <path d="M-5 0 H5" />
    </Along>
  );
}

export function Capacitor({ from, to, hl }: { from: Pt; to: Pt } & Stroke) {
  return (
    <Along from={from} to={to} half={2.2} hl={hl}>
      <path d="M-2.2 -7 V7 M2.2 -7 V7" />
    </Along>
  );
}

/** Zig-zag resistor. */
export function Resistor({ from, to, hl }: { from: Pt; to: Pt } & Stroke) {
  return (
    <Along from={from} to={to} half={9} hl={hl}>
      <path d="M-9 0 L-7.5 -3.5 L-4.5 3.5 L-1.5 -3.5 L1.5 3.5 L4.5 -3.5 L7.5 3.5 L9 0" strokeLinejoin="round" />
    </Along>
  );
}

/** Coil of `turns` half-circle bumps between two terminals; `side` picks which side they bulge to. */
export function Coil({ from, to, turns = 4, side = 1, hl }: { from: Pt; to: Pt; turns?: number; side?: 1 | -1 } & Stroke) {
  const len = Math.hypot(to[0] - from[0], to[1] - from[1]);
  const r = Math.min(4.5, len / (2 * turns));
  const w = r * turns;
  const sweep = side === 1 ? 0 : 1;
  const arcs = Array.from({ length: turns }, () => `a${r} ${r} 0 0 ${sweep} ${2 * r} 0`).join(' ');
  return (
    <Along from={from} to={to} half={w} hl={hl}>
      <path d={`M${-w} 0 ${arcs}`} />
    </Along>
  );
}

/**
 * Enhancement MOSFET between drain `d` and source `s` (vertical or horizontal), body tied to the
 * source; the arrow points in for N-channel, out for P-channel. Drawn drain-above-source, the gate
 * lead points left; `gate="right"` mirrors it. Other orientations rotate the whole symbol.
 */
export function Mosfet({ d, s, channel = 'n', gate = 'left', hl }: { d: Pt; s: Pt; channel?: 'n' | 'p'; gate?: 'left' | 'right' } & Stroke) {
  const len = Math.hypot(s[0] - d[0], s[1] - d[1]);
  const h = len / 2;
  const deg = (Math.atan2(s[1] - d[1], s[0] - d[0]) * 180) / Math.PI - 90;
  const mirror = gate === 'right' ? ' scale(-1 1)' : '';
  const fine = hl ? 1.6 : WIRE_W; // keep the gate and channel gaps readable when highlighted
  const arrow = channel === 'n' ? 'M-6 0 L-2.2 -2.3 L-2.2 2.3 Z' : 'M-1 0 L-4.8 -2.3 L-4.8 2.3 Z';
  return (
    <g transform={`translate(${(d[0] + s[0]) / 2} ${(d[1] + s[1]) / 2}) rotate(${deg})${mirror}`} {...stroke(hl)}>
      <path d="M-9.5 -7 V7 M-17 0 H-9.5" strokeWidth={fine} />
      <path d="M-6 -8 V-3.5 M-6 -2 V2 M-6 3.5 V8" strokeWidth={fine} />
      <path d="M-6 -5.75 H0 M-6 5.75 H0 M-6 0 H0 V5.75" strokeWidth={fine} strokeLinejoin="round" />
      <path d={`M0 -5.75 V${-h} M0 5.75 V${h}`} />
      <path d={arrow} fill={hl ?? INK} stroke="none" />
    </g>
  );
}

/** DC source centred at (x, y) with its + terminal up. */
export function Source({ x, y, hl }: { x: number; y: number } & Stroke) {
  return (
    <g {...stroke(hl)}>
      <circle cx={x} cy={y} r={9} />
      <path d={`M${x - 2.5} ${y - 4} H${x + 2.5} M${x} ${y - 6.5} V${y - 1.5} M${x - 2.5} ${y + 4.5} H${x + 2.5}`} strokeWidth={1.2} />
    </g>
  );
}

/** Earth/ground mark hanging below (x, y). */
export function Ground({ x, y }: { x: number; y: number }) {
  return (
    <path d={`M${x} ${y} V${y + 4} M${x - 6} ${y + 4} H${x + 6} M${x - 3.8} ${y + 6.8} H${x + 3.8} M${x - 1.6} ${y + 9.6} H${x + 1.6}`} {...stroke()} />
  );
}

/** Polarity dot of a winding. */
export function PolarityDot({ at, hl }: { at: Pt } & Stroke) {
  return <circle cx={at[0]} cy={at[1]} r={1.9} fill={hl ?? INK} />;
}

/** Component label. */
export function Label({ x, y, children, anchor = 'start', hl, size = 9.5 }: { x: number; y: number; children: ReactNode; anchor?: 'start' | 'middle' | 'end'; size?: number } & Stroke) {
  return (
    <text x={x} y={y} fontSize={size} fontFamily={FONT} textAnchor={anchor} fill={hl ?? INK} fontWeight={hl ? 600 : 400}>
      {children}
    </text>
  );
}
