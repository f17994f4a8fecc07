/**
 * Small power-stage schematic of one forward-converter reset scheme, sized for a comparison card.
 * The components and wires that carry the magnetizing current while the core resets are drawn in
 * the scheme's colour (thicker); everything else is neutral ink.
 */
import { memo, type JSX } from 'react';
import type { SchemeId } from '../../../engine/scheme-ids';
import { SCHEME_LABELS } from '../../../engine/scheme-ids';
import { SCHEME_STYLES } from '../../../lib/scheme-style';
import { H, W } from './drawings/common';
import { SCHEME_DRAWINGS, type Variant } from './registry';
import { FONT, HL_W, INK } from './symbols';

export interface SchemeSchematicProps {
  scheme: SchemeId;
  activeClampVariant?: 'high-side' | 'low-side';
  rectifier?: 'diode' | 'synchronous';
  className?: string;
}

/** One-sentence description of the drawing (also the accessible name). */
export function describeScheme(scheme: SchemeId, variant: Variant, rectifier: 'diode' | 'synchronous'): string {
  const rect = rectifier === 'synchronous' ? 'synchronous rectifiers SR1 and SR2' : 'diode rectifiers D1 and D2';
  return `${SCHEME_LABELS[scheme]} forward with ${rect}: ${SCHEME_DRAWINGS[scheme].describe(variant)}`;
}

function SchemeSchematic({ scheme, activeClampVariant = 'high-side', rectifier = 'diode', className }: SchemeSchematicProps): JSX.Element {
  const { color } = SCHEME_STYLES[scheme];
  const description = describeScheme(scheme, activeClampVariant, rectifier);
  const drawing = SCHEME_DRAWINGS[scheme];
  const Art = drawing.default;
  const caption = drawing.caption(activeClampVariant);
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
      <Art variant={activeClampVariant} color={color} rectifier={rectifier} />
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
