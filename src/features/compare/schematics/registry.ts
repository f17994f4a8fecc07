import type { JSX } from 'react';
import type { SchemeId } from '../../../engine/scheme-ids';
import type { DrawingProps } from './drawings/common';
import * as ActiveClamp from './drawings/ActiveClamp';
import * as Rcd from './drawings/Rcd';
import * as Resonant from './drawings/Resonant';
import * as Tertiary from './drawings/Tertiary';
import * as TwoSwitch from './drawings/TwoSwitch';

export type Variant = 'high-side' | 'low-side';

/** A scheme's schematic: the drawing (art, one file per scheme), its description and an optional caption. */
export interface SchemeDrawing {
  default: (p: DrawingProps & { variant: Variant }) => JSX.Element;
  describe(variant: Variant): string;
  caption(variant: Variant): string | null;
}

/** Scheme id → drawing. The UI registry of schematics: the type checker asks for every scheme. */
export const SCHEME_DRAWINGS: Readonly<Record<SchemeId, SchemeDrawing>> = {
  'tertiary-winding': Tertiary,
  'rcd-clamp': Rcd,
  'active-clamp': ActiveClamp,
  'two-switch': TwoSwitch,
  'resonant-reset': Resonant,
};
