/** Parts shared by every reset-scheme drawing: input source and rails, transformer, output stage. */
import { Capacitor, Coil, Diode, Ground, INK, Junction, Label, Mosfet, PolarityDot, Resistor, Source, Wire } from '../symbols';

/** Drawing grid (user units; the SVG viewBox is W x H). */
export const W = 320;
export const H = 172;
export const RAIL = 20; // Vin+ rail
export const GND = 136; // primary return
export const VIN_X = 20;
export const NP_X = 150; // primary winding (bumps face the core on the right)
export const NP_TOP = 48;
export const NP_BOT = 84;
const CORE_X = 158;
const NS_X = 168;
const SEC_RET = 104;
const K_X = 204; // rectifier cathode node
const L_END = 240;
const C_X = 254;
const LOAD_X = 284;

export type Rectifier = 'diode' | 'synchronous';

export interface DrawingProps {
  color: string;
  rectifier: Rectifier;
}

/** Vin source with the + rail from the source to `railTo` and the return from the source to `gndTo`. */
export function Input({ railTo, gndTo }: { railTo: number; gndTo: number }) {
  const cy = (RAIL + GND) / 2;
  return (
    <g>
      <Wire pts={[[VIN_X, cy - 9], [VIN_X, RAIL], [railTo, RAIL]]} />
      <Wire pts={[[VIN_X, cy + 9], [VIN_X, GND], [gndTo, GND]]} />
      <Source x={VIN_X} y={cy} />
      <Ground x={VIN_X} y={GND} />
      <Label x={VIN_X + 13} y={cy + 3.5}>Vin</Label>
    </g>
  );
}

/** Primary winding Np (dot at the top), the core and, optionally, how far the core reaches down. */
export function Primary({ hl, coreBottom = NP_BOT + 4, caption = 'Np' }: { hl?: string | undefined; coreBottom?: number; caption?: string }) {
  return (
    <g>
      <Coil from={[NP_X, NP_TOP]} to={[NP_X, NP_BOT]} side={-1} hl={hl} />
      <PolarityDot at={[NP_X - 5, NP_TOP + 3]} hl={hl} />
      <Label x={NP_X - 6} y={(NP_TOP + NP_BOT) / 2 + 6} anchor="end" hl={hl}>{caption}</Label>
      <path d={`M${CORE_X - 1.6} ${NP_TOP - 4} V${coreBottom} M${CORE_X + 1.6} ${NP_TOP - 4} V${coreBottom}`} stroke={INK} strokeWidth={1.2} />
    </g>
  );
}

/** Secondary winding Ns, forward and freewheeling rectifiers, output LC filter and load. */
export function Secondary({ rectifier }: { rectifier: Rectifier }) {
  const y = NP_TOP;
  const sync = rectifier === 'synchronous';
  const mid = (y + SEC_RET) / 2;
  return (
    <g>
      <Coil from={[NS_X, NP_TOP]} to={[NS_X, NP_BOT]} side={1} />
      <PolarityDot at={[NS_X + 5, NP_TOP + 3]} />
      <Label x={NS_X + 6} y={(NP_TOP + NP_BOT) / 2 + 6}>Ns</Label>
      {sync ? (
        <>
          <Mosfet s={[NS_X, y]} d={[K_X - 4, y]} />
          <Label x={(NS_X + K_X) / 2 + 9} y={y - 11}>SR1</Label>
          <Mosfet d={[K_X, y]} s={[K_X, SEC_RET]} gate="right" />
          <Label x={K_X - 4} y={mid + 16} anchor="end">SR2</Label>
        </>
      ) : (
        <>
          <Diode from={[NS_X, y]} to={[K_X, y]} />
          <Label x={(NS_X + K_X) / 2 + 2} y={y - 9} anchor="middle">D1</Label>
          <Diode from={[K_X, SEC_RET]} to={[K_X, y]} />
          <Label x={K_X + 8} y={mid + 4}>D2</Label>
        </>
      )}
      <Coil from={[K_X, y]} to={[L_END, y]} turns={4} side={-1} />
      <Label x={(K_X + L_END) / 2} y={y - 9} anchor="middle">L</Label>
      <Wire pts={[[L_END, y], [LOAD_X, y], [LOAD_X, y + 10]]} />
      <Capacitor from={[C_X, y]} to={[C_X, SEC_RET]} />
      <Label x={C_X + 9} y={mid + 4}>C</Label>
      <Resistor from={[LOAD_X, y + 10]} to={[LOAD_X, SEC_RET - 10]} />
      <Label x={LOAD_X + 7} y={mid + 4}>Load</Label>
      <Wire pts={[[NS_X, NP_BOT], [NS_X, SEC_RET], [LOAD_X, SEC_RET], [LOAD_X, SEC_RET - 10]]} />
      {sync && <Wire pts={[[K_X - 4, y], [K_X, y]]} />}
      {[K_X, C_X].map((x) => (
        <g key={x}>
          <Junction at={[x, y]} />
          <Junction at={[x, SEC_RET]} />
        </g>
      ))}
    </g>
  );
}

/** Low-side main switch Q1 from the primary's bottom (drain node at `drainY`) to the return. */
export function LowSideQ1({ drainY = NP_BOT + 8 }: { drainY?: number }) {
  return (
    <g>
      <Wire pts={[[NP_X, NP_BOT], [NP_X, drainY + 4]]} />
      <Mosfet d={[NP_X, drainY + 4]} s={[NP_X, GND - 4]} />
      <Wire pts={[[NP_X, GND - 4], [NP_X, GND]]} />
      <Label x={NP_X + 5} y={GND - 8}>Q1</Label>
    </g>
  );
}
