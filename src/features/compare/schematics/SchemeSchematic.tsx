/**
 * Small power-stage schematic of one forward-converter reset scheme, sized for a comparison card.
 * The components and wires that carry the magnetizing current while the core resets are drawn in
 * the scheme's colour (thicker); everything else is neutral ink.
 */
import { memo, type JSX } from 'react';
import type { SchemeId } from '../../../engine/scheme-ids';
import { SCHEME_LABELS } from '../../../engine/scheme-ids';
import { SCHEME_STYLES } from '../../../lib/scheme-style';
import ActiveClamp from './drawings/ActiveClamp';
import { H, W, type DrawingProps } from './drawings/common';
import Rcd from './drawings/Rcd';
import Resonant from './drawings/Resonant';
import Tertiary from './drawings/Tertiary';
import TwoSwitch from './drawings/TwoSwitch';
import { FONT, HL_W, INK } from './symbols';

export interface SchemeSchematicProps {
  scheme: SchemeId;
  activeClampVariant?: 'high-side' | 'low-side';
  rectifier?: 'diode' | 'synchronous';
  className?: string;
}

type Variant = 'high-side' | 'low-side';

/** One-sentence description of the drawing (also the accessible name). */
export function describeScheme(scheme: SchemeId, variant: Variant, rectifier: 'diode' | 'synchronous'): string {
  const rect = rectifier === 'synchronous' ? 'synchronous rectifiers SR1 and SR2' : 'diode rectifiers D1 and D2';
  const lead = `${SCHEME_LABELS[scheme]} forward with ${rect}`;
  switch (scheme) {
    case 'tertiary-winding':
      return `${lead}: low-side switch Q1; reset winding Nr (opposite dot) and reset diode Dr return magnetizing energy to the input (highlighted).`;
    case 'rcd-clamp':
      return `${lead}: low-side switch Q1; clamp diode Dc charges Cc in parallel with Rc from the drain to the input rail, and Rc dissipates the magnetizing energy (highlighted).`;
    case 'active-clamp':
      return variant === 'high-side'
        ? `${lead}: low-side switch Q1; high-side clamp of capacitor Cc in series with N-channel switch Q2 from the drain to the input rail recycles the magnetizing energy (highlighted).`
        : `${lead}: low-side switch Q1; low-side clamp of capacitor Cc in series with P-channel switch Q2 from the drain to ground recycles the magnetizing energy (highlighted).`;
    case 'two-switch':
      return `${lead}: Q1 high-side and Q2 low-side; clamp diodes D3 and D4 return magnetizing energy to the input (highlighted).`;
    case 'resonant-reset':
      return `${lead}: low-side switch Q1 with capacitor Cr (including Coss) across drain and source; the magnetizing inductance Lm rings with Cr to reset the core (highlighted).`;
  }
}

function Drawing({ scheme, variant, ...p }: DrawingProps & { scheme: SchemeId; variant: Variant }) {
  switch (scheme) {
    case 'tertiary-winding':
      return <Tertiary {...p} />;
    case 'rcd-clamp':
      return <Rcd {...p} />;
    case 'active-clamp':
      return <ActiveClamp {...p} variant={variant} />;
    case 'two-switch':
      return <TwoSwitch {...p} />;
    case 'resonant-reset':
      return <Resonant {...p} />;
  }
}

function SchemeSchematic({ scheme, activeClampVariant = 'high-side', rectifier = 'diode', className }: SchemeSchematicProps): JSX.Element {
  const { color } = SCHEME_STYLES[scheme];
  const description = describeScheme(scheme, activeClampVariant, rectifier);
  const caption =
    scheme === 'active-clamp'
      ? activeClampVariant === 'high-side'
        ? 'high-side clamp, N-channel Q2'
        : 'low-side clamp, P-channel Q2'
      : null;
  const legendY = H - 8;
  return (
    <svg
      role="img"
      aria-label={description}
      viewBox={`0 0 ${W} ${H}`}
      width="100%"
      preserveAspectRatio="xMidYMid meet"
      className={className}
      style={{ display: 'block', height: 'auto' }}
    >
      <title>{`${SCHEME_LABELS[scheme]} reset, forward converter power stage`}</title>
      <Drawing scheme={scheme} variant={activeClampVariant} color={color} rectifier={rectifier} />
      <g fontFamily={FONT} fontSize={9}>
        <path d={`M8 ${legendY - 3} H26`} stroke={color} strokeWidth={HL_W} strokeLinecap="round" />
        <text x={31} y={legendY} fill={color} fontWeight={600}>
          reset path
        </text>
        {caption && (
          <text x={W - 8} y={legendY} fill={INK} textAnchor="end">
            {caption}
          </text>
        )}
      </g>
    </svg>
  );
}

/** Memoised: on Compare every edit re-renders the cards, but a schematic changes only with its props. */
export default memo(SchemeSchematic);
