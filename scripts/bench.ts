/**
 * Benchmark: scheme-evaluations per second on one core, for the full evaluation (findings,
 * trace, efficiency vs load, BOM lines) and for the lean path a sweep uses. Prints figures only.
 */
import { evaluateLean, evaluateNormalised, parseSpecInput, SCHEME_IDS, type NormalisedSpec } from '../src/engine/index';
import { demoSpecs } from '../src/demo/specs';

const specs: NormalisedSpec[] = demoSpecs.map((d) => {
  const p = parseSpecInput(d.requirements);
  if (!p.ok) throw new Error(p.errors.map((e) => e.message).join('; '));
  return p.value;
});

/** Run `fn` in batches for about `seconds`; return calls per second. */
function rate(fn: (i: number) => unknown, seconds: number): number {
  let sink = 0;
  for (let i = 0; i < 20000; i++) sink += fn(i) ? 1 : 0; // warm-up
  let calls = 0;
  const start = performance.now();
  const end = start + seconds * 1000;
  let now = start;
  while (now < end) {
    for (let i = 0; i < 5000; i++) sink += fn(calls + i) ? 1 : 0;
    calls += 5000;
    now = performance.now();
  }
  if (sink < 0) console.log(sink);
  return (calls * 1000) / (now - start);
}

const schemes = SCHEME_IDS;
const nS = specs.length;
const nK = schemes.length;
const lean = rate((i) => evaluateLean(specs[i % nS]!, schemes[(i / nS | 0) % nK]!), 3);
const fullSpecs = specs.map((s) => s);
const full = rate((i) => evaluateNormalised(fullSpecs[i % nS]!), 3) * nK;
const fmt = (x: number): string => Math.round(x).toLocaleString('en-US');
console.log(`lean path:       ${fmt(lean)} scheme-evaluations/s (target ≥ 2,000,000)`);
console.log(`full evaluation: ${fmt(full)} scheme-evaluations/s (target ≥ 200,000; ${fmt(full / nK)} comparisons of ${nK} schemes/s)`);
