import { useId, type ReactNode } from 'react';

interface Props {
  title: string;
  /** One line: what the chart shows and under which condition. */
  caption?: ReactNode;
  /** Legend or controls shown between the caption and the chart. */
  children?: ReactNode;
  /** The chart itself; placed in a fixed-height box Chart.js sizes itself to. */
  chart: ReactNode;
  height?: number;
  className?: string;
  /** Heading level: h3 for cards, h4 inside a card. */
  level?: 3 | 4;
  /** Render without the card border (panels inside another card). */
  bare?: boolean;
  /** Stable name for tests and print styles (`data-chart`). */
  name?: string;
}

/** A titled chart with a one-line caption; keeps together on a printed page. */
export function ChartCard({ title, caption, children, chart, height = 240, className = '', level = 3, bare = false, name }: Props) {
  const id = useId();
  const Heading = level === 3 ? 'h3' : 'h4';
  return (
    <section aria-labelledby={id} data-chart={name} className={`${bare ? '' : 'card p-3'} flex min-w-0 flex-col gap-2 break-inside-avoid ${className}`}>
      <div>
        <Heading id={id} className={level === 3 ? 'text-sm font-semibold text-ink' : 'text-xs font-semibold text-ink'}>
          {title}
        </Heading>
        {caption ? <p className="text-xs text-muted">{caption}</p> : null}
      </div>
      {children}
      {/* Chart.js needs a positioned box; the canvas is kept within it on screen and in print. */}
      <div className="relative w-full [&_canvas]:max-w-full" style={{ height }}>
        {chart}
      </div>
    </section>
  );
}
