/** Active clamp: Cc in series with auxiliary switch Q2, high-side (to Vin+) or low-side (to return). */
import { Capacitor, Junction, Label, Mosfet, Wire } from '../symbols';
import { GND, Input, LowSideQ1, NP_BOT, NP_TOP, NP_X, Primary, RAIL, Secondary, type DrawingProps } from './common';

const DRAIN_Y = NP_BOT + 8;
const Q2_X = 100;

export default function ActiveClamp({ color, rectifier, variant }: DrawingProps & { variant: 'high-side' | 'low-side' }) {
  const high = variant === 'high-side';
  return (
    <g>
      <Input railTo={NP_X} gndTo={NP_X} />
      <Secondary rectifier={rectifier} />
      <LowSideQ1 drainY={DRAIN_Y} />
      <Wire pts={[[NP_X, RAIL], [NP_X, NP_TOP]]} hl={color} />
      <Primary hl={color} />
      <Wire pts={[[NP_X, DRAIN_Y], [Q2_X, DRAIN_Y]]} hl={color} />
      <Junction at={[NP_X, DRAIN_Y]} hl={color} />
      {high ? (
        <>
          {/* Reset path: Np -> drain -> Q2 (source at the drain node) -> Cc -> Vin+ -> Np */}
          <Wire pts={[[Q2_X, RAIL], [NP_X, RAIL]]} hl={color} />
          <Junction at={[Q2_X, RAIL]} hl={color} />
          <Mosfet d={[Q2_X, 56]} s={[Q2_X, DRAIN_Y]} hl={color} />
          <Label x={Q2_X + 5} y={DRAIN_Y - 5} hl={color}>Q2</Label>
          <Capacitor from={[Q2_X, 56]} to={[Q2_X, RAIL]} hl={color} />
          <Label x={Q2_X + 10} y={41} hl={color}>Cc</Label>
        </>
      ) : (
        <>
          {/* Reset path: Np -> drain -> Cc -> P-channel Q2 (source grounded) -> return */}
          <Capacitor from={[126, DRAIN_Y]} to={[Q2_X, DRAIN_Y]} hl={color} />
          <Label x={(126 + Q2_X) / 2} y={DRAIN_Y - 10} anchor="middle" hl={color}>Cc</Label>
          <Wire pts={[[Q2_X, DRAIN_Y], [Q2_X, DRAIN_Y + 8]]} hl={color} />
          <Mosfet d={[Q2_X, DRAIN_Y + 8]} s={[Q2_X, GND - 4]} channel="p" hl={color} />
          <Wire pts={[[Q2_X, GND - 4], [Q2_X, GND]]} hl={color} />
          <Junction at={[Q2_X, GND]} hl={color} />
          <Label x={Q2_X + 5} y={GND - 8} hl={color}>Q2</Label>
        </>
      )}
    </g>
  );
}

/** What the drawing shows, after "<scheme> forward with <rectifiers>: " (its accessible name). */
export const describe = (variant: 'high-side' | 'low-side'): string => (variant === 'high-side'
  ? 'low-side switch Q1; high-side clamp of capacitor Cc in series with N-channel switch Q2 from the drain to the input rail recycles the magnetizing energy (highlighted).'
  : 'low-side switch Q1; low-side clamp of capacitor Cc in series with P-channel switch Q2 from the drain to ground recycles the magnetizing energy (highlighted).');

/** The clamp's variant under the drawing. */
export const caption = (variant: 'high-side' | 'low-side'): string | null => (variant === 'high-side' ? 'high-side clamp, N-channel Q2' : 'low-side clamp, P-channel Q2');
