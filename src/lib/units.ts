/**
 * Reads quantities the way engineers type them: `48`, `48 V`, `200k`, `200 kHz`, `2.2u`,
 * `2.2 µF`, `4m7`-style is not accepted. Prefixes: p n u µ m k M G (case matters for m/M).
 */
const PREFIX: Record<string, number> = { p: 1e-12, n: 1e-9, u: 1e-6, 'µ': 1e-6, 'μ': 1e-6, m: 1e-3, k: 1e3, K: 1e3, M: 1e6, G: 1e9 };

export type QuantityKind = 'V' | 'A' | 'Hz' | 'F' | 'H' | 'W' | 'ratio' | 'count' | 'degC' | 'money';

export type ParsedQuantity = { ok: true; value: number } | { ok: false; message: string };

const UNIT_WORDS: Partial<Record<QuantityKind, string[]>> = {
  V: ['V'], A: ['A'], Hz: ['Hz', 'hz', 'HZ'], F: ['F'], H: ['H'], W: ['W'], degC: ['°C', 'C', 'degC'],
};

/** Parses `text` as a quantity of `kind` into base SI units (ratios accept `%`). */
export function parseQuantity(text: string, kind: QuantityKind): ParsedQuantity {
  const trimmed = text.trim().replace(/,/g, '.').replace(/\s+/g, ' ');
  if (trimmed === '') return { ok: false, message: 'enter a value' };
  const match = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*(.*)$/i.exec(trimmed);
  if (!match) return { ok: false, message: `"${text.trim()}" is not a number` };
  const number = Number(match[1]);
  let rest = match[2]!.trim();
  if (kind === 'ratio') {
    if (rest === '%') return { ok: true, value: number / 100 };
    return rest === '' ? { ok: true, value: number } : { ok: false, message: `"${rest}" is not understood here; use a fraction (0.3) or a percentage (30 %)` };
  }
  if (kind === 'money') {
    return rest === '' ? { ok: true, value: number } : { ok: false, message: 'enter a plain amount in the library currency' };
  }
  const units = UNIT_WORDS[kind] ?? [];
  const unit = units.find((u) => rest.endsWith(u) && (rest.length === u.length || PREFIX[rest.slice(0, -u.length).trim()] !== undefined));
  if (unit) rest = rest.slice(0, -unit.length).trim();
  if (kind === 'degC') return rest === '' ? { ok: true, value: number } : { ok: false, message: 'enter the temperature in °C' };
  if (rest === '') return { ok: true, value: number };
  const scale = PREFIX[rest];
  if (scale === undefined) {
    const expected = units[0] ?? '';
    return { ok: false, message: `"${match[2]!.trim()}" is not a unit of ${kind === 'count' ? 'a count' : expected}; try e.g. 200k${kind === 'count' ? '' : ` or 200 k${expected}`}` };
  }
  if (kind === 'count' && scale < 1) return { ok: false, message: 'a count takes k or M, not a fraction prefix' };
  return { ok: true, value: number * scale };
}
