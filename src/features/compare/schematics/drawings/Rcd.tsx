/** RCD clamp: Dc from the drain into Rc || Cc tied to Vin+; the clamp dissipates the magnetizing energy. */
import { Capacitor, Diode, Junction, Label, Resistor, Wire } from '../symbols';
import { Input, LowSideQ1, NP_BOT, NP_TOP, NP_X, Primary, RAIL, Secondary, type DrawingProps } from './common';

const DC_X = 102;
const RC_X = 86;
const CC_X = 118;
const DRAIN_Y = NP_BOT + 8;
const TOP_Y = 58; // Dc cathode / clamp node

export default function Rcd({ color, rectifier }: DrawingProps) {
  return (
    <g>
      <Input railTo={NP_X} gndTo={NP_X} />
      <Secondary rectifier={rectifier} />
      <LowSideQ1 drainY={DRAIN_Y} />
      {/* Reset path: Np -> drain -> Dc -> Rc || Cc -> Vin+ -> Np */}
      <Wire pts={[[NP_X, RAIL], [NP_X, NP_TOP]]} hl={color} />
      <Wire pts={[[RC_X, RAIL], [NP_X, RAIL]]} hl={color} />
      <Primary hl={color} />
      <Wire pts={[[NP_X, DRAIN_Y], [DC_X, DRAIN_Y]]} hl={color} />
      <Junction at={[NP_X, DRAIN_Y]} hl={color} />
      <Diode from={[DC_X, DRAIN_Y]} to={[DC_X, TOP_Y]} hl={color} />
      <Label x={DC_X - 8} y={DRAIN_Y - 11} anchor="end" hl={color}>Dc</Label>
      <Wire pts={[[RC_X, TOP_Y], [CC_X, TOP_Y]]} hl={color} />
      <Junction at={[DC_X, TOP_Y]} hl={color} />
      <Resistor from={[RC_X, TOP_Y]} to={[RC_X, RAIL]} hl={color} />
      <Label x={RC_X - 7} y={(TOP_Y + RAIL) / 2 + 4} anchor="end" hl={color}>Rc</Label>
      <Capacitor from={[CC_X, TOP_Y]} to={[CC_X, RAIL]} hl={color} />
      <Label x={CC_X + 10} y={(TOP_Y + RAIL) / 2 + 4} hl={color}>Cc</Label>
      <Junction at={[RC_X, RAIL]} hl={color} />
      <Junction at={[CC_X, RAIL]} hl={color} />
    </g>
  );
}

/** What the drawing shows, after "<scheme> forward with <rectifiers>: " (its accessible name). */
export const describe = (): string => 'low-side switch Q1; clamp diode Dc charges Cc in parallel with Rc from the drain to the input rail, and Rc dissipates the magnetizing energy (highlighted).';

/** No caption under this drawing. */
export const caption = (): string | null => null;
