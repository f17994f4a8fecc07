/**
 * Edit-to-render timing for the Compare screen: an edit leaves a mark, every island that
 * re-renders for it reports how long after the mark its commit landed. The browser test reads
 * `window.__resetwiseUpdates`; nothing else depends on it.
 */
declare global {
  interface Window {
    __resetwiseUpdates?: { island: string; ms: number }[];
  }
}

let lastEdit = 0;

export function markEdit(): void {
  if (typeof performance !== 'undefined') lastEdit = performance.now();
}

export function markRendered(island: string): void {
  if (typeof window === 'undefined' || lastEdit === 0) return;
  (window.__resetwiseUpdates ??= []).push({ island, ms: performance.now() - lastEdit });
}
