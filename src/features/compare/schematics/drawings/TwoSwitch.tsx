/** Two-switch forward: D3 and D4 clamp the primary to Vin and return magnetizing energy to the input. */
import { Diode, HopWire, Junction, Label, Mosfet, Wire } from '../symbols';
import { GND, Input, NP_BOT, NP_TOP, NP_X, Primary, RAIL, Secondary, type DrawingProps } from './common';

const LEG_X = 92; // Q1 over D3
const D4_X = 118;
const B_Y = NP_BOT + 8; // primary bottom node

export default function TwoSwitch({ color, rectifier }: DrawingProps) {
  return (
    <g>
      <Input railTo={D4_X} gndTo={NP_X} />
      <Secondary rectifier={rectifier} />
      <Mosfet d={[LEG_X, RAIL]} s={[LEG_X, NP_TOP]} />
      <Junction at={[LEG_X, RAIL]} />
      <Label x={LEG_X + 5} y={RAIL + 13}>Q1</Label>
      <Wire pts={[[NP_X, NP_BOT], [NP_X, B_Y + 4]]} hl={color} />
      <Mosfet d={[NP_X, B_Y + 4]} s={[NP_X, GND - 4]} />
      <Wire pts={[[NP_X, GND - 4], [NP_X, GND]]} />
      <Label x={NP_X + 5} y={GND - 8}>Q2</Label>
      {/* Reset path: return -> D3 -> primary (dot end in) -> D4 -> Vin+ */}
      <Diode from={[LEG_X, GND]} to={[LEG_X, NP_TOP]} hl={color} />
      <Junction at={[LEG_X, GND]} hl={color} />
      <Label x={LEG_X + 8} y={(NP_TOP + GND) / 2 + 4} hl={color}>D3</Label>
      <Wire pts={[[LEG_X, NP_TOP], [NP_X, NP_TOP]]} hl={color} />
      <Junction at={[LEG_X, NP_TOP]} hl={color} />
      <Primary hl={color} />
      <Wire pts={[[NP_X, B_Y], [D4_X, B_Y]]} hl={color} />
      <Junction at={[NP_X, B_Y]} hl={color} />
      <Diode from={[D4_X, B_Y]} to={[D4_X, NP_TOP + 8]} hl={color} />
      <HopWire x={D4_X} y1={NP_TOP + 8} y2={RAIL} hopY={NP_TOP} hl={color} />
      <Label x={D4_X - 8} y={NP_TOP + 22} anchor="end" hl={color}>D4</Label>
    </g>
  );
}

/** What the drawing shows, after "<scheme> forward with <rectifiers>: " (its accessible name). */
export const describe = (): string => 'Q1 high-side and Q2 low-side; clamp diodes D3 and D4 return magnetizing energy to the input (highlighted).';

/** No caption under this drawing. */
export const caption = (): string | null => null;
