import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { SCHEME_IDS, type SchemeId } from '../../src/engine/scheme-ids';
import { SCHEME_STYLES } from '../../src/lib/scheme-style';
import SchemeSchematic, { type SchemeSchematicProps } from '../../src/features/compare/schematics/SchemeSchematic';

type Rect = NonNullable<SchemeSchematicProps['rectifier']>;
type Variant = NonNullable<SchemeSchematicProps['activeClampVariant']>;

/** Labels that must appear (as text) for each scheme, whatever the rectifier. */
const LABELS: Record<SchemeId, string[]> = {
  'tertiary-winding': ['Q1', 'Nr', 'Dr', 'Np'],
  'rcd-clamp': ['Q1', 'Dc', 'Rc', 'Cc', 'Np'],
  'active-clamp': ['Q1', 'Q2', 'Cc', 'Np'],
  'two-switch': ['Q1', 'Q2', 'D3', 'D4', 'Np'],
  'resonant-reset': ['Q1', 'Cr (incl. Coss)', 'Np (Lm)'],
};
const COMMON = ['Vin', 'Ns', 'L', 'C', 'Load'];
const RECT_LABELS: Record<Rect, string[]> = { diode: ['D1', 'D2'], synchronous: ['SR1', 'SR2'] };

const cases: { scheme: SchemeId; rectifier: Rect; variant?: Variant }[] = [];
for (const scheme of SCHEME_IDS) {
  for (const rectifier of ['diode', 'synchronous'] as const) {
    if (scheme === 'active-clamp') for (const variant of ['high-side', 'low-side'] as const) cases.push({ scheme, rectifier, variant });
    else cases.push({ scheme, rectifier });
  }
}

// Plain .ts (the vitest include pattern is *.test.ts), so no JSX here.
function render(p: SchemeSchematicProps): { html: string; texts: string[] } {
  const html = renderToStaticMarkup(createElement(SchemeSchematic, p));
  const texts = [...html.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1] ?? '');
  return { html, texts };
}

const unescape = (s: string) => s.replace(/&amp;/g, '&').replace(/&quot;/g, '"').replace(/&#x27;/g, "'");

describe('SchemeSchematic', () => {
  it.each(cases)('$scheme / $rectifier / $variant', ({ scheme, rectifier, variant }) => {
    const { html, texts } = render({ scheme, rectifier, ...(variant ? { activeClampVariant: variant } : {}) });
    const open = /^<svg\b[^>]*>/.exec(html)?.[0] ?? '';
    expect(open).toMatch(/\brole="img"/);
    expect(open).toMatch(/viewBox="0 0 \d+ \d+"/);
    expect(open).toMatch(/width="100%"/);
    const aria = unescape(/aria-label="([^"]*)"/.exec(open)?.[1] ?? '');
    expect(aria.length).toBeGreaterThan(40);
    expect(aria).toMatch(/\(highlighted\)\.$/);
    const title = /<title>([^<]+)<\/title>/.exec(html)?.[1] ?? '';
    expect(title.trim()).not.toBe('');

    const labels = texts.map(unescape);
    for (const l of [...LABELS[scheme], ...COMMON, ...RECT_LABELS[rectifier]]) expect(labels).toContain(l);
    const other = rectifier === 'diode' ? RECT_LABELS.synchronous : RECT_LABELS.diode;
    for (const l of other) expect(labels).not.toContain(l);
    expect(labels).toContain('reset path');

    const { color } = SCHEME_STYLES[scheme];
    expect(html).toContain(`stroke="${color}"`);
    // No other scheme's colour leaks into this drawing.
    for (const s of SCHEME_IDS) if (s !== scheme) expect(html).not.toContain(SCHEME_STYLES[s].color);

    expect(html).not.toMatch(/https?:|url\(|href=|<image|<use|<foreignObject|<script|<style/i);
  });

  it('names the active-clamp variant and the Q2 channel type', () => {
    const low = render({ scheme: 'active-clamp', activeClampVariant: 'low-side' });
    const high = render({ scheme: 'active-clamp', activeClampVariant: 'high-side' });
    expect(low.texts.join('|')).toMatch(/low-side.*P-channel/);
    expect(high.texts.join('|')).toMatch(/high-side.*N-channel/);
    expect(low.html).toMatch(/aria-label="[^"]*P-channel/);
    expect(high.html).toMatch(/aria-label="[^"]*N-channel/);
    // Default variant is high-side.
    expect(render({ scheme: 'active-clamp' }).html).toBe(high.html);
  });

  it('describes the two-switch circuit in one sentence', () => {
    const { html } = render({ scheme: 'two-switch' });
    const aria = unescape(/aria-label="([^"]*)"/.exec(html)?.[1] ?? '');
    expect(aria).toContain('Q1 high-side and Q2 low-side; clamp diodes D3 and D4 return magnetizing energy to the input (highlighted).');
    expect(aria.split('. ').length).toBe(1);
  });

  it('passes className through and every text uses Noto Sans at 9 to 10 px', () => {
    const { html } = render({ scheme: 'rcd-clamp', className: 'card-schematic' });
    expect(html).toMatch(/^<svg[^>]*class="card-schematic"/);
    const texts = [...html.matchAll(/<text\b[^>]*>/g)].map((m) => m[0]);
    expect(texts.length).toBeGreaterThan(10);
    for (const t of texts) {
      const size = Number(/font-size="([\d.]+)"/.exec(t)?.[1] ?? 9);
      expect(size).toBeGreaterThanOrEqual(9);
      expect(size).toBeLessThanOrEqual(10);
    }
    expect(html).toContain('font-family="Noto Sans, sans-serif"');
  });

  it('draws the tertiary reset winding with the opposite dot and highlights only the reset parts', () => {
    const { html } = render({ scheme: 'tertiary-winding' });
    const { color } = SCHEME_STYLES['tertiary-winding'];
    // Nr and Dr labels are in the scheme colour; Q1 and Np are neutral.
    expect(html).toMatch(new RegExp(`fill="${color}"[^>]*>Nr<`));
    expect(html).toMatch(new RegExp(`fill="${color}"[^>]*>Dr<`));
    expect(html).not.toMatch(new RegExp(`fill="${color}"[^>]*>Q1<`));
    expect(html).not.toMatch(new RegExp(`fill="${color}"[^>]*>Np<`));
  });
});
