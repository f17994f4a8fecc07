import { useRef } from 'react';

/**
 * Structural equality of chart inputs: plain objects and arrays compared member by member, numbers
 * with `Object.is` (NaN equals NaN, 0 and −0 differ), anything else (functions included) by identity.
 */
export function sameData(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameData(a[i], b[i])) return false;
    return true;
  }
  if (Array.isArray(b) || Object.getPrototypeOf(a) !== Object.getPrototypeOf(b)) return false;
  const keys = Object.keys(a);
  if (keys.length !== Object.keys(b).length) return false;
  for (const key of keys) {
    if (!Object.prototype.hasOwnProperty.call(b, key)) return false;
    if (!sameData((a as Record<string, unknown>)[key], (b as Record<string, unknown>)[key])) return false;
  }
  return true;
}

/**
 * `value`, or the value from the previous render while the new one is structurally equal. Chart
 * data and options built from it then keep their identity, so react-chartjs-2 leaves a chart whose
 * inputs did not change alone instead of running a full Chart.js update and redraw.
 */
export function useStable<T>(value: T): T {
  const kept = useRef(value);
  if (kept.current !== value && !sameData(kept.current, value)) kept.current = value;
  return kept.current;
}
