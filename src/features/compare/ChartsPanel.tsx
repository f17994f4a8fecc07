import { useStore } from '@nanostores/react';
import { lazy, Suspense, useEffect, useRef, useState } from 'react';
import { $evaluation } from '../../stores/evaluation';
import { $library } from '../../stores/library';
import { markRendered } from '../../lib/perf';
import { ensureLoaded } from './init';

// Chart.js is most of the page's script; it loads when the charts come near the viewport.
const CompareCharts = lazy(() => import('./charts/CompareCharts'));

/** The charts island: follows the live comparison like the cards. */
export default function ChartsPanel() {
  ensureLoaded();
  const { comparison, current } = useStore($evaluation);
  const library = useStore($library);
  const anchor = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    if (near || !anchor.current) return;
    const target = anchor.current;
    const observer = new IntersectionObserver((entries) => entries.some((e) => e.isIntersecting) && setNear(true), { rootMargin: '400px' });
    // Each island hydrates on its own. Until the scheme cards are on the page the charts sit near the top and would
    // count as near on every load, fetching Chart.js with the first load; so watch only once the cards are laid out
    // (or after 3 s, should they never come).
    const cardsShown = (): boolean => document.querySelector('[data-scheme-card]') !== null;
    let started = false;
    const start = (): void => {
      if (started) return;
      started = true;
      cards.disconnect();
      window.clearTimeout(timer);
      observer.observe(target);
    };
    const cards = new MutationObserver(() => cardsShown() && start());
    const timer = window.setTimeout(start, 3000);
    if (cardsShown()) start(); else cards.observe(document.body, { childList: true, subtree: true });
    return () => { cards.disconnect(); window.clearTimeout(timer); observer.disconnect(); };
  }, [near]);
  useEffect(() => markRendered('charts'), [comparison]);
  if (!comparison || !library) return null;
  const waiting = <p className="card p-6 text-sm text-muted">Drawing the charts…</p>;
  return (
    <div ref={anchor} className={current ? '' : 'opacity-55'} data-charts>
      {near ? <Suspense fallback={waiting}><CompareCharts comparison={comparison} library={library} /></Suspense> : waiting}
    </div>
  );
}
