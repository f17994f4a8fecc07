// Server figures for the README: ready time after build, POST /api/v1/evaluate latency at 100
// concurrent connections (autocannon, loopback), resident memory at rest and under that load.
// Uses the build in dist/ (or RESETWISE_DIST); run `npm run build` first.
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';

const built = path.join(process.env.RESETWISE_DIST ?? 'dist', 'server/entry.mjs');
if (!existsSync(built)) throw new Error(`${built} is missing: run \`npm run build\` first`);
const entry = 'scripts/serve.mjs'; // serves the build in RESETWISE_DIST (default dist/)

const port = await new Promise<number>((resolve) => {
  const probe = createServer().listen(0, '127.0.0.1', () => {
    const a = probe.address();
    probe.close(() => resolve(typeof a === 'object' && a ? a.port : 0));
  });
});
const dataDir = mkdtempSync(path.join(tmpdir(), 'resetwise-bench-'));
const base = `http://127.0.0.1:${port}`;
const rssMiB = (pid: number): number => {
  const line = readFileSync(`/proc/${pid}/status`, 'utf8').split('\n').find((l) => l.startsWith('VmRSS:'));
  return Number(line?.match(/(\d+)/)?.[1] ?? 0) / 1024;
};

/** User + system CPU time of a process so far (ms): per-request cost that holds up on a busy machine. */
const cpuMs = (pid: number): number => {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
  return (Number(fields[11]) + Number(fields[12])) * 10; // utime + stime, clock ticks of 10 ms
};

/** Starts the server on `dataDir`; resolves with the child and the time until /health answered. */
async function start(): Promise<{ child: ReturnType<typeof spawn>; readyMs: number }> {
  const t0 = performance.now();
  const child = spawn(process.execPath, [entry], { env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), DATA_DIR: dataDir, RESETWISE_DEMO: '1' }, stdio: 'ignore' });
  for (;;) {
    try {
      if ((await fetch(`${base}/api/v1/health`)).ok) return { child, readyMs: performance.now() - t0 };
    } catch { /* starting */ }
    if (performance.now() - t0 > 60_000) throw new Error('server did not start');
    await new Promise((r) => setTimeout(r, 20));
  }
}

// First start creates the database (initdb, migrations, demo seed); the restart is the everyday case.
const first = await start();
await new Promise((r) => setTimeout(r, 1500));
const firstRestMiB = rssMiB(first.child.pid!);
first.child.kill('SIGTERM');
await new Promise((r) => first.child.once('exit', r));
const { child, readyMs } = await start();
try {
  const signIn = await fetch(`${base}/api/v1/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'engineer@resetwise.example', password: 'resetwise-demo' }) });
  const cookie = signIn.headers.getSetCookie()[0]!.split(';')[0]!;
  await new Promise((r) => setTimeout(r, 1500));
  const restMiB = rssMiB(child.pid!);
  const body = readFileSync('examples/telecom-brick-36-75v-12v.json', 'utf8');
  let peakMiB = restMiB;
  const sampler = setInterval(() => { peakMiB = Math.max(peakMiB, rssMiB(child.pid!)); }, 200);
  const cpuBeforeMs = cpuMs(child.pid!);
  const result = await autocannon({
    url: `${base}/api/v1/evaluate`, method: 'POST', connections: 100, duration: 10,
    headers: { 'content-type': 'application/json', cookie }, body,
  });
  clearInterval(sampler);
  const serverCpuMs = cpuMs(child.pid!) - cpuBeforeMs;
  const afterMiB = rssMiB(child.pid!);
  console.log(`Server ready: first start ${first.readyMs.toFixed(0)} ms (an empty data folder: the database from the build's template, demo seed; ${firstRestMiB.toFixed(0)} MiB resident after it), restart ${readyMs.toFixed(0)} ms`);
  console.log(`POST /api/v1/evaluate, 100 connections, 10 s: ${result.requests.total} requests, ${result.non2xx} non-2xx, ${result.errors} errors; p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms, ${result.requests.average.toFixed(0)} req/s`);
  console.log(`Server CPU time per request under that load: ${(serverCpuMs / Math.max(1, result.requests.total)).toFixed(2)} ms (${serverCpuMs} ms for ${result.requests.total} requests; one core serves at most ≈ ${Math.round((1000 * result.requests.total) / Math.max(1, serverCpuMs))} req/s)`);
  // The floor under any route: the cheapest one (readiness, a 16-byte JSON reply, no session), same load.
  const floorCpuBeforeMs = cpuMs(child.pid!);
  const floor = await autocannon({ url: `${base}/api/v1/health`, connections: 100, duration: 5 });
  const floorCpuMs = cpuMs(child.pid!) - floorCpuBeforeMs;
  console.log(`Floor: GET /api/v1/health, 100 connections, 5 s: ${floor.requests.total} requests, ${floor.non2xx} non-2xx; p50 ${floor.latency.p50} ms, p99 ${floor.latency.p99} ms, ${floor.requests.average.toFixed(0)} req/s, ${(floorCpuMs / Math.max(1, floor.requests.total)).toFixed(2)} ms server CPU per request`);
  console.log(`Resident memory after a restart: ${restMiB.toFixed(0)} MiB at rest, ${peakMiB.toFixed(0)} MiB peak under load, ${afterMiB.toFixed(0)} MiB after`);
  console.log(`Load average (1, 5, 15 min) at the end: ${loadavg().map((l) => l.toFixed(2)).join(', ')} on this ${availableParallelism()}-core machine`);
} finally {
  child.kill('SIGTERM');
  await new Promise((r) => child.once('exit', r));
  rmSync(dataDir, { recursive: true, force: true });
}
