import type { QuantityKind } from './units';
import { formatSi } from './si';

export type NumericFieldKey =
  | 'vinMinV' | 'vinNomV' | 'vinMaxV' | 'voutV' | 'ioutA' | 'fswHz' | 'voutRippleV' | 'rippleRatio'
  | 'ambientC' | 'annualVolume' | 'targetEfficiency' | 'targetUnitCost' | 'maxDuty' | 'voltageDerating'
  | 'leakageRatio' | 'resetTurnsRatio';
export type ChoiceFieldKey = 'rectifier' | 'activeClampVariant' | 'windingArrangement';
export type FieldKey = NumericFieldKey | ChoiceFieldKey;

export interface NumericField {
  key: NumericFieldKey;
  label: string;
  kind: QuantityKind;
  /** Shown as a percentage rather than a fraction. */
  percent?: boolean;
  required: boolean;
  hint: string;
  group: 'electrical' | 'targets' | 'design';
}

export interface ChoiceField {
  key: ChoiceFieldKey;
  label: string;
  options: { value: string; label: string }[];
  hint: string;
  group: 'design';
}

/** The requirement-set form, in the order an engineer reads a spec sheet. */
export const NUMERIC_FIELDS: NumericField[] = [
  { key: 'vinMinV', label: 'Input minimum', kind: 'V', required: true, group: 'electrical', hint: 'lowest input at which the output holds, incl. hold-up' },
  { key: 'vinNomV', label: 'Input nominal', kind: 'V', required: true, group: 'electrical', hint: 'efficiency is quoted here' },
  { key: 'vinMaxV', label: 'Input maximum', kind: 'V', required: true, group: 'electrical', hint: 'highest steady input' },
  { key: 'voutV', label: 'Output voltage', kind: 'V', required: true, group: 'electrical', hint: '' },
  { key: 'ioutA', label: 'Output current', kind: 'A', required: true, group: 'electrical', hint: 'full load' },
  { key: 'fswHz', label: 'Switching frequency', kind: 'Hz', required: true, group: 'electrical', hint: '10 kHz – 5 MHz' },
  { key: 'voutRippleV', label: 'Output ripple', kind: 'V', required: false, group: 'electrical', hint: 'peak-to-peak; default 1 % of the output' },
  { key: 'rippleRatio', label: 'Inductor ripple', kind: 'ratio', percent: true, required: false, group: 'electrical', hint: 'ΔIL / Iout; default 30 %' },
  { key: 'annualVolume', label: 'Annual volume', kind: 'count', required: false, group: 'targets', hint: 'units per year, for price tiers; default 1000' },
  { key: 'targetEfficiency', label: 'Efficiency target', kind: 'ratio', percent: true, required: false, group: 'targets', hint: 'at nominal input, full load' },
  { key: 'targetUnitCost', label: 'Unit cost target', kind: 'money', required: false, group: 'targets', hint: 'power-stage BOM, library currency' },
  { key: 'ambientC', label: 'Ambient', kind: 'degC', required: false, group: 'targets', hint: '°C; default 40' },
  { key: 'maxDuty', label: 'Controller duty limit', kind: 'ratio', percent: true, required: false, group: 'design', hint: 'default 75 %' },
  { key: 'voltageDerating', label: 'Voltage derating', kind: 'ratio', percent: true, required: false, group: 'design', hint: 'share of a rating that may be used; default 80 %' },
  { key: 'leakageRatio', label: 'Leakage / magnetizing', kind: 'ratio', percent: true, required: false, group: 'design', hint: 'Llk / Lm; empty: estimated from the transformer build' },
  { key: 'resetTurnsRatio', label: 'Tertiary Nr/Np', kind: 'ratio', required: false, group: 'design', hint: 'reset-winding turns ratio; default 1' },
];

export const CHOICE_FIELDS: ChoiceField[] = [
  { key: 'rectifier', label: 'Output rectifier', group: 'design', hint: '', options: [{ value: 'diode', label: 'Diodes' }, { value: 'synchronous', label: 'Synchronous MOSFETs' }] },
  { key: 'activeClampVariant', label: 'Active-clamp variant', group: 'design', hint: '', options: [{ value: 'high-side', label: 'High-side (N-MOSFET)' }, { value: 'low-side', label: 'Low-side (P-MOSFET)' }] },
  { key: 'windingArrangement', label: 'Transformer windings', group: 'design', hint: 'sets the leakage estimate', options: [{ value: 'non-interleaved', label: 'Not interleaved' }, { value: 'interleaved', label: 'Interleaved P–S–P' }] },
];

const UNIT_OF: Partial<Record<QuantityKind, string>> = { V: 'V', A: 'A', Hz: 'Hz', F: 'F', H: 'H', W: 'W' };

/** The text a field shows for a stored SI value (parses back to the same value). */
export function fieldText(field: NumericField, value: unknown): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '';
  if (field.percent) return `${Number((value * 100).toPrecision(4))} %`;
  if (field.kind === 'degC') return `${value} °C`;
  const unit = UNIT_OF[field.kind];
  return unit ? formatSi(value, unit, 4) : String(Number(value.toPrecision(6)));
}
