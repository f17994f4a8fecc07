/**
 * Benchmark: scheme-evaluations per second on one core (one thread, no workers), for the lean
 * path a design-space sweep calls (`evaluateLean`) and for the full evaluation (findings, trace,
 * efficiency vs load, BOM lines; `evaluateNormalised`, counted per scheme).
 *
 * Honest measurement: 1,024 distinct requirement sets (the demo specs scaled in input range,
 * output voltage and current, frequency, rectifier and volume; each checked by the schema), every result consumed into a
 * checksum that is printed, a warm-up of about a second before each timing, and each timing runs
 * for at least `SECONDS`. Wall-clock rate is the figure; the CPU share (process CPU time / wall
 * time) shows whether the machine was busy with other work while measuring.
 */
import { demoPartsLibrary, evaluate, evaluateLean, evaluateNormalised, parseSpecInput, SCHEME_IDS, type NormalisedSpec } from '../src/engine/index';
import { demoSpecs } from '../src/demo/specs';
import { DEFAULT_SETTINGS, planSweep } from '../src/features/sweep/plan';
import { runSweep, STRIDE } from '../src/features/sweep/run';
import { buildCostStacks, buildLossStacks } from '../src/features/compare/charts/stacks';
import { buildDutySeries, buildStressSeries, buildSweeps } from '../src/features/compare/charts/sweep-series';
import { buildWaveSeries } from '../src/features/compare/charts/wave-series';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 2);
const N_SPECS = 1024;

/**
 * Deterministic variations of the demo specs (32-bit LCG, Numerical Recipes constants), built the
 * way a sweep builds its points: each demo spec parsed once, each point a spread of it with new
 * values. With `parseEach`, every point is instead parsed on its own (as API requests are).
 */
function variedSpecs(parseEach: boolean): NormalisedSpec[] {
  let seed = 12345;
  const rnd = (): number => ((seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 2 ** 32);
  const parse = (raw: object): NormalisedSpec => {
    const p = parseSpecInput(raw);
    if (!p.ok) throw new Error(p.errors.map((e) => e.message).join('; '));
    return p.value;
  };
  const bases = demoSpecs.map((d) => parse(d.requirements));
  const out: NormalisedSpec[] = [];
  for (let k = 0; k < N_SPECS; k++) {
    const base = bases[k % bases.length]!;
    const vin = 0.7 + 0.8 * rnd();
    const vout = 0.6 + 0.8 * rnd();
    const point: NormalisedSpec = {
      ...base,
      vinMinV: base.vinMinV * vin, vinNomV: base.vinNomV * vin, vinMaxV: base.vinMaxV * vin,
      voutV: base.voutV * vout, voutRippleV: base.voutRippleV * vout,
      ioutA: base.ioutA * (0.3 + 1.2 * rnd()), fswHz: base.fswHz * (0.5 + 1.5 * rnd()),
      rectifier: rnd() < 0.5 ? 'diode' : 'synchronous',
      annualVolume: [100, 1000, 10000, 100000][Math.floor(4 * rnd())]!,
    };
    const { schemes: _schemes, weights: _weights, overrides: _overrides, ...raw } = point;
    out.push(parseEach ? parse(raw) : parse(raw) && point);
  }
  return out;
}

interface Rate { perS: number; cpuShare: number; checksum: number }

/** Call `fn(i)` in batches: ~1 s warm-up, then at least `seconds` timed. */
function rate(fn: (i: number) => number, seconds: number): Rate {
  let sum = 0;
  let i = 0;
  const warmEnd = performance.now() + 1000;
  while (performance.now() < warmEnd) for (let k = 0; k < 1000; k++) sum += fn(i++);
  let calls = 0;
  const cpu0 = process.cpuUsage();
  const start = performance.now();
  const end = start + seconds * 1000;
  let now = start;
  while (now < end) {
    for (let k = 0; k < 1000; k++) sum += fn(i++);
    calls += 1000;
    now = performance.now();
  }
  const cpu = process.cpuUsage(cpu0);
  return { perS: (calls * 1000) / (now - start), cpuShare: (cpu.user + cpu.system) / 1000 / (now - start), checksum: sum };
}

const nK = SCHEME_IDS.length;

/** Lean rate over a spec list: i → spec i mod 1024, scheme i mod 5 (coprime, so every pair occurs). */
function leanRate(specs: NormalisedSpec[]): Rate {
  return rate((i) => {
    const r = evaluateLean(specs[i & (N_SPECS - 1)]!, SCHEME_IDS[i % nK]!);
    return r.score + r.lossW + r.bomCost;
  }, SECONDS);
}

const specs = variedSpecs(false);
const lean = leanRate(specs);
const full = rate((i) => {
  const c = evaluateNormalised(specs[i & (N_SPECS - 1)]!);
  let s = 0;
  for (const r of c.results) s += r.score + r.findings.length + Object.keys(r.trace).length + r.efficiencyVsLoad.length;
  return s;
}, SECONDS);
const leanParsed = leanRate(variedSpecs(true));

/**
 * The Sweep screen's own loop (features/sweep/run.ts) over the plan its browser test runs: the first demo
 * brick with 13 log-spaced frequencies, 5 duty limits and every usable switch, rectifier and core (101,920
 * points). Points that differ only in the main switch share the engine's front stages. Best of 5 timed runs
 * after 3 warm-up runs, one thread.
 */
function sweepFigure(): { points: number; bestMs: number; checksum: number } {
  const brick = demoSpecs.find((d) => d.requirements.vinMaxV === 75);
  if (!brick) throw new Error('the demo brick is missing from the demo specs');
  const parsed = parseSpecInput(brick.requirements);
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => e.message).join('; '));
  const plan = planSweep(parsed.value, demoPartsLibrary, { ...DEFAULT_SETTINGS, fswSteps: 13 });
  const out = new Float64Array(plan.total * STRIDE);
  let bestMs = Infinity, checksum = 0;
  for (let r = 0; r < 8; r++) {
    const t0 = performance.now();
    runSweep(parsed.value, demoPartsLibrary, plan, out);
    if (r >= 3) bestMs = Math.min(bestMs, performance.now() - t0);
  }
  for (let i = 0; i < out.length; i++) checksum += out[i]!;
  return { points: plan.total, bestMs, checksum };
}
const sweep = sweepFigure();

/** Compare's chart data for every scheme of one comparison (what a live edit rebuilds before Chart.js draws). */
function chartDataFigure(): { bestMs: number; medianMs: number } {
  const base = evaluate(demoSpecs[0]!.requirements);
  const times: number[] = [];
  for (let r = 0; r < 23; r++) {
    const c = structuredClone(base); // a new comparison each run, as after an edit (the chart code caches by identity)
    const t0 = performance.now();
    const sweeps = buildSweeps(c, demoPartsLibrary);
    buildStressSeries(sweeps);
    buildDutySeries(sweeps);
    buildLossStacks(c);
    buildCostStacks(c);
    buildWaveSeries(c, c.ranking[0]!, demoPartsLibrary);
    if (r >= 3) times.push(performance.now() - t0);
  }
  times.sort((x, y) => x - y);
  return { bestMs: times[0]!, medianMs: times[times.length >> 1]! };
}
const charts = chartDataFigure();

const fmt = (x: number): string => Math.round(x).toLocaleString('en-US');
const pct = (x: number): string => `${Math.round(100 * x)} %`;
const tail = (r: Rate): string => `CPU share ${pct(r.cpuShare)}; checksum ${r.checksum.toExponential(6)}`;
console.log(`lean path:       ${fmt(lean.perS)} scheme-evaluations/s (target ≥ 2,000,000; ${tail(lean)})`);
console.log(`full evaluation: ${fmt(full.perS * nK)} scheme-evaluations/s (target ≥ 200,000; ${fmt(full.perS)} comparisons of ${nK} schemes/s; ${tail(full)})`);
console.log(`lean, each spec from its own parseSpecInput call: ${fmt(leanParsed.perS)} scheme-evaluations/s (${tail(leanParsed)})`);
console.log(`sweep loop (Sweep screen, shared front stages): ${fmt(sweep.points)} design points in ${sweep.bestMs.toFixed(0)} ms on one thread, ${fmt((1000 * sweep.points) / sweep.bestMs)} points/s (best of 5 after 3 warm-up runs; checksum ${sweep.checksum.toExponential(6)})`);
console.log(`Compare chart data, every chart for ${nK} schemes: median ${charts.medianMs.toFixed(1)} ms, best ${charts.bestMs.toFixed(1)} ms (20 runs after 3 warm-up; budget of a live edit 20 ms)`);
