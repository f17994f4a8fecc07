import { categoryInfo } from './categories';

const show = (v: unknown): string =>
  Array.isArray(v) ? v.map((t: { minQty?: number; unitPrice?: number }) => `${t.minQty}: ${t.unitPrice}`).join(' · ') : v === null || v === undefined ? '—' : String(v);

/** One readable line per stored change: "changed tiers 1: 0.5 · 1000: 0.4 → …". */
export function historyLines(changes: Record<string, unknown>[]): { id: string; text: string }[] {
  return changes.map((c) => {
    const what = categoryInfo(String(c.category))?.singular ?? String(c.category);
    if (c.op === 'add') return { id: String(c.id), text: `${what} added` };
    if (c.op === 'retire') return { id: String(c.id), text: `${what} retired` };
    const fields = Object.entries((c.fields as Record<string, { from: unknown; to: unknown }>) ?? {});
    return { id: String(c.id), text: `${what} changed: ${fields.map(([k, v]) => `${k} ${show(v.from)} → ${show(v.to)}`).join('; ')}` };
  });
}
