import { Chart } from 'chart.js';

let installed = false;

/**
 * Canvas charts print at the screen's pixel ratio, which looks soft on paper from a 1× screen.
 * Before printing, every chart is redrawn at `ratio`× (at least the screen's); afterwards it goes back.
 */
export function installPrintSharpness(ratio = 3): void {
  if (installed || typeof window === 'undefined') return;
  installed = true;
  const redraw = (pixelRatio: number | undefined) => {
    for (const chart of Object.values(Chart.instances)) {
      chart.options.devicePixelRatio = pixelRatio;
      chart.resize();
    }
  };
  window.addEventListener('beforeprint', () => redraw(Math.max(ratio, window.devicePixelRatio || 1)));
  window.addEventListener('afterprint', () => redraw(undefined));
}
