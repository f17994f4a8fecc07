/** Resonant reset: Cr (including the switch's Coss) rings with the magnetizing inductance Lm. */
import { Capacitor, Junction, Label, Wire } from '../symbols';
import { GND, Input, LowSideQ1, NP_BOT, NP_TOP, NP_X, Primary, RAIL, Secondary, type DrawingProps } from './common';

const CR_X = 110;
const DRAIN_Y = NP_BOT + 8;

export default function Resonant({ color, rectifier }: DrawingProps) {
  return (
    <g>
      <Input railTo={NP_X} gndTo={NP_X} />
      <Secondary rectifier={rectifier} />
      <LowSideQ1 drainY={DRAIN_Y} />
      {/* Reset path: Lm (primary) <-> drain node <-> Cr across drain-source, through the input */}
      <Wire pts={[[NP_X, RAIL], [NP_X, NP_TOP]]} hl={color} />
      <Primary hl={color} caption="Np (Lm)" />
      <Wire pts={[[NP_X, DRAIN_Y], [CR_X, DRAIN_Y]]} hl={color} />
      <Junction at={[NP_X, DRAIN_Y]} hl={color} />
      <Capacitor from={[CR_X, DRAIN_Y]} to={[CR_X, GND]} hl={color} />
      <Junction at={[CR_X, GND]} hl={color} />
      <Label x={CR_X - 10} y={(DRAIN_Y + GND) / 2 + 4} anchor="end" hl={color}>Cr (incl. Coss)</Label>
    </g>
  );
}

/** What the drawing shows, after "<scheme> forward with <rectifiers>: " (its accessible name). */
export const describe = (): string => 'low-side switch Q1 with capacitor Cr (including Coss) across drain and source; the magnetizing inductance Lm rings with Cr to reset the core (highlighted).';

/** No caption under this drawing. */
export const caption = (): string | null => null;
