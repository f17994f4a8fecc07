import type { Plugin } from 'chart.js';
import { markRendered } from '../../../lib/perf';
import { isWarming } from './warm';

/**
 * Reports `chart:<name>` to the edit timing (`src/lib/perf.ts`) each time the chart is drawn
 * after an update, so a test can tell which charts an edit redrew and when the last one finished.
 */
export function drawnReporter(name: string): Plugin {
  let updated = false;
  return {
    id: 'resetwiseDrawn',
    afterUpdate(chart) {
      if (isWarming(chart)) return;
      updated = true;
    },
    afterRender() {
      if (!updated) return;
      updated = false;
      markRendered(`chart:${name}`);
    },
  };
}
