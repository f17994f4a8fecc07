import { formatSi } from '../../lib/si';

/** Areas and volumes read and show in mm² and mm³ (a prefix would apply to the metre, not the m²). */
export const SMALL_UNITS: Record<string, { unit: string; ascii: string; scale: number }> = {
  'm²': { unit: 'mm²', ascii: 'mm2', scale: 1e6 },
  'm³': { unit: 'mm³', ascii: 'mm3', scale: 1e9 },
};

const PREFIX: Record<string, number> = { p: 1e-12, n: 1e-9, u: 1e-6, 'µ': 1e-6, 'μ': 1e-6, m: 1e-3, k: 1e3, M: 1e6, G: 1e9 };

/**
 * Reads a part value as an engineer types it: `1.5e-9`, `45n`, `45 nC`, `20 mΩ`, `650 V`.
 * `unit` is the field's SI unit ('' for plain numbers); returns the value in base SI units.
 */
export function parseSiValue(text: string, unit: string): { ok: true; value: number } | { ok: false; message: string } {
  const small = SMALL_UNITS[unit];
  if (small) {
    const plain = text.trim().replace(/,/g, '.').replace(new RegExp(`\\s*(${small.unit}|${small.ascii})$`), '');
    if (plain === '') return { ok: false, message: 'enter a value' };
    return /^[-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?$/i.test(plain) ? { ok: true, value: Number(plain) / small.scale } : { ok: false, message: `"${text.trim()}" is not a number of ${small.unit}` };
  }
  const trimmed = text.trim().replace(/,/g, '.');
  if (trimmed === '') return { ok: false, message: 'enter a value' };
  const match = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*(.*)$/i.exec(trimmed);
  if (!match) return { ok: false, message: `"${trimmed}" is not a number` };
  let rest = match[2]!.trim();
  if (unit && rest.endsWith(unit)) rest = rest.slice(0, -unit.length).trim();
  if (rest === '') return { ok: true, value: Number(match[1]) };
  const scale = PREFIX[rest];
  if (scale === undefined) return { ok: false, message: `"${match[2]!.trim()}" is not understood; use a number${unit ? ` in ${unit}` : ''}, optionally with a prefix (n, µ, m, k)` };
  return { ok: true, value: Number(match[1]) * scale };
}

/** The text a part field shows in the form (reads back with `parseSiValue`). */
export function valueText(value: unknown, unit: string): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '';
  const small = SMALL_UNITS[unit];
  if (small) return `${Number((value * small.scale).toPrecision(6))} ${small.unit}`;
  if (!unit) return String(value);
  return formatSi(value, unit, 6).replace(/\s+/g, ' ');
}

/** A part value for the table, 3 significant figures with its unit. */
export function displayValue(value: unknown, unit: string | undefined): string {
  if (typeof value !== 'number') return String(value ?? '—');
  const small = unit ? SMALL_UNITS[unit] : undefined;
  if (small) return `${Number((value * small.scale).toPrecision(3))} ${small.unit}`;
  // Voltage classes read as the trade writes them: 1200 V, not 1.2 kV.
  if (unit === 'V' && Math.abs(value) >= 1000 && Math.abs(value) < 10_000) return `${Number(value.toPrecision(4))} V`;
  return unit ? formatSi(value, unit) : String(Number(value.toPrecision(4)));
}
