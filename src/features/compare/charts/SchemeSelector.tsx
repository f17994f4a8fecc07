import { memo, useRef, type KeyboardEvent } from 'react';
import type { SchemeId } from '../../../engine/index';
import { SCHEME_STYLES } from '../../../lib/scheme-style';
import { Swatch } from './Swatch';

interface Props {
  options: { scheme: SchemeId; label: string }[];
  value: SchemeId;
  onChange: (scheme: SchemeId) => void;
  label: string;
}

/**
 * Segmented scheme picker with radio-group semantics: Tab reaches the chosen scheme, arrow keys
 * (and Home/End) move and choose, as in any radio group.
 */
export const SchemeSelector = memo(function SchemeSelector({ options, value, onChange, label }: Props) {
  const buttons = useRef<(HTMLButtonElement | null)[]>([]);
  const current = Math.max(0, options.findIndex((o) => o.scheme === value));

  const move = (index: number) => {
    const n = options.length;
    if (n === 0) return;
    const next = ((index % n) + n) % n;
    const option = options[next];
    if (!option) return;
    onChange(option.scheme);
    buttons.current[next]?.focus();
  };

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    const steps: Record<string, number> = { ArrowRight: 1, ArrowDown: 1, ArrowLeft: -1, ArrowUp: -1 };
    if (event.key in steps) move(current + (steps[event.key] ?? 0));
    else if (event.key === 'Home') move(0);
    else if (event.key === 'End') move(options.length - 1);
    else return;
    event.preventDefault();
  };

  return (
    <div role="radiogroup" aria-label={label} onKeyDown={onKeyDown} className="inline-flex flex-wrap gap-0.5 rounded-md border border-line bg-canvas p-0.5 print:hidden">
      {options.map((o, i) => {
        const checked = i === current;
        const style = SCHEME_STYLES[o.scheme];
        return (
          <button
            key={o.scheme}
            ref={(el) => {
              buttons.current[i] = el;
            }}
            type="button"
            role="radio"
            aria-checked={checked}
            tabIndex={checked ? 0 : -1}
            onClick={() => onChange(o.scheme)}
            className={`inline-flex items-center gap-1.5 rounded px-2.5 py-1 text-xs font-medium ${
              checked ? 'border border-line bg-panel text-ink shadow-sm' : 'border border-transparent text-muted hover:text-ink'
            }`}
          >
            <Swatch color={style.color} dash={[]} marker={style.marker} width={14} />
            {o.label}
          </button>
        );
      })}
    </div>
  );
});
