/** Tertiary-winding reset: reset winding Nr (opposite dot) and Dr return magnetizing energy to Vin. */
import { Coil, Diode, HopWire, Junction, Label, Mosfet, PolarityDot, Wire } from '../symbols';
import { GND, Input, NP_BOT, NP_TOP, NP_X, Primary, RAIL, Secondary, type DrawingProps } from './common';

const Q_X = 100;
const DR_X = 124;
const NR_TOP = 98;
const NR_BOT = 125;
const DRAIN_Y = 89;

export default function Tertiary({ color, rectifier }: DrawingProps) {
  return (
    <g>
      <Input railTo={NP_X} gndTo={NP_X} />
      <Wire pts={[[NP_X, RAIL], [NP_X, NP_TOP]]} />
      <Primary coreBottom={NR_BOT + 3} />
      <Secondary rectifier={rectifier} />
      {/* Q1 sits left of the core because Nr shares the primary side of the core. */}
      <Wire pts={[[NP_X, NP_BOT], [NP_X, DRAIN_Y], [Q_X, DRAIN_Y], [Q_X, DRAIN_Y + 7]]} />
      <Mosfet d={[Q_X, DRAIN_Y + 7]} s={[Q_X, GND - 6]} />
      <Wire pts={[[Q_X, GND - 6], [Q_X, GND]]} />
      <Junction at={[Q_X, GND]} />
      <Label x={Q_X + 5} y={GND - 10}>Q1</Label>
      {/* Reset path: return -> Nr (dot at the return end) -> Dr -> Vin+ */}
      <Wire pts={[[NP_X, GND], [NP_X, NR_BOT]]} hl={color} />
      <Coil from={[NP_X, NR_TOP]} to={[NP_X, NR_BOT]} turns={3} side={-1} hl={color} />
      <PolarityDot at={[NP_X - 5, NR_BOT - 3]} hl={color} />
      <Label x={NP_X - 9} y={NR_TOP + 14} anchor="end" hl={color}>Nr</Label>
      <Wire pts={[[NP_X, NR_TOP], [DR_X, NR_TOP]]} hl={color} />
      <HopWire x={DR_X} y1={NR_TOP} y2={66} hopY={DRAIN_Y} hl={color} />
      <Diode from={[DR_X, 66]} to={[DR_X, RAIL]} hl={color} />
      <Junction at={[DR_X, RAIL]} hl={color} />
      <Label x={DR_X - 8} y={47} anchor="end" hl={color}>Dr</Label>
    </g>
  );
}

/** What the drawing shows, after "<scheme> forward with <rectifiers>: " (its accessible name). */
export const describe = (): string => 'low-side switch Q1; reset winding Nr (opposite dot) and reset diode Dr return magnetizing energy to the input (highlighted).';

/** No caption under this drawing. */
export const caption = (): string | null => null;
