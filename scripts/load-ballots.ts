// `npm run load:ballots [-- --url http://127.0.0.1:4321] [--voters 200]`
// Creates N voters through the API, opens a shortlist to them and has all of them cast their
// ballots at the same moment; checks that the tally counts exactly N ballots and prints the
// ballot endpoint's latency. Without --url it starts the built server (dist/) on a free
// loopback port with a throw-away data folder (demo mode) and stops it afterwards
// (RESETWISE_DIST names another build folder).
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';

const { values } = parseArgs({ options: { url: { type: 'string' }, voters: { type: 'string', default: '200' } } });
const voterCount = Number(values.voters);
if (!Number.isInteger(voterCount) || voterCount < 1 || voterCount > 1000) throw new RangeError('--voters must be a whole number from 1 to 1000');

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

let child: ChildProcess | undefined;
let dataDir: string | undefined;
let base = values.url?.replace(/\/$/, '');
if (!base) {
  const port = await freePort();
  dataDir = mkdtempSync(path.join(tmpdir(), 'resetwise-load-'));
  child = spawn(process.execPath, ['scripts/serve.mjs'], { env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), DATA_DIR: dataDir, RESETWISE_DEMO: '1' }, stdio: 'ignore' });
  base = `http://127.0.0.1:${port}`;
  for (let i = 0; i < 600; i++) {
    try { if ((await fetch(`${base}/api/v1/health`)).ok) break; } catch { /* starting */ }
    await new Promise((r) => setTimeout(r, 100));
  }
}
const origin = base;

async function call(method: string, route: string, cookie: string | undefined, body?: unknown): Promise<{ status: number; json: any; cookie?: string }> {
  const response = await fetch(`${origin}/api/v1${route}`, {
    method,
    headers: { 'content-type': 'application/json', origin, ...(cookie ? { cookie } : {}) },
    ...(body !== undefined ? { body: JSON.stringify(body) } : {}),
  });
  const set = response.headers.getSetCookie().find((c) => c.startsWith('rw_session='));
  return { status: response.status, json: await response.json().catch(() => null), ...(set ? { cookie: set.split(';')[0]! } : {}) };
}

async function signIn(email: string, password: string): Promise<string> {
  const reply = await call('POST', '/auth/sign-in', undefined, { email, password });
  if (reply.status !== 200 || !reply.cookie) throw new Error(`sign-in ${email}: ${reply.status} ${JSON.stringify(reply.json)}`);
  return reply.cookie;
}

async function inBatches<T, R>(items: T[], size: number, work: (item: T) => Promise<R>): Promise<R[]> {
  const out: R[] = [];
  for (let i = 0; i < items.length; i += size) out.push(...(await Promise.all(items.slice(i, i + size).map(work))));
  return out;
}

/** User + system CPU time of the server this script started (ms), or null for --url. */
const serverCpuMs = (): number | null => {
  if (!child?.pid) return null;
  const fields = readFileSync(`/proc/${child.pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
  return (Number(fields[11]) + Number(fields[12])) * 10; // utime + stime, clock ticks of 10 ms
};

const percentile = (sorted: number[], p: number): number => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;

try {
  const admin = await signIn('admin@resetwise.example', 'resetwise-demo');
  const architect = await signIn('architect@resetwise.example', 'resetwise-demo');
  const run = Date.now().toString(36);
  const password = 'load-test-password';
  console.log(`Creating ${voterCount} voters through POST /api/v1/users…`);
  const voters = await inBatches(Array.from({ length: voterCount }, (_, i) => i), 8, async (i) => {
    const reply = await call('POST', '/users', admin, { email: `voter${i}-${run}@load.example`, name: `Load voter ${i}`, role: 'engineer', password });
    if (reply.status !== 201) throw new Error(`create voter ${i}: ${reply.status} ${JSON.stringify(reply.json)}`);
    return reply.json as { id: string; email: string };
  });
  const shortlist = await call('POST', '/shortlists', architect, { specId: 'demo-spec-1', title: `Load test ${run}` });
  const candidates: string[] = [];
  for (const scheme of ['two-switch', 'active-clamp', 'rcd-clamp']) candidates.push((await call('POST', `/shortlists/${shortlist.json.id}/candidates`, architect, { scheme })).json.id);
  const deadline = new Date(Date.now() + 86_400_000 * 2).toISOString();
  const opened = await call('POST', `/shortlists/${shortlist.json.id}/open`, architect, { deadline, voterIds: voters.map((v) => v.id) });
  if (opened.status !== 200) throw new Error(`open: ${opened.status} ${JSON.stringify(opened.json)}`);
  console.log(`Signing the ${voterCount} voters in…`);
  const cookies = await inBatches(voters, 8, (v) => signIn(v.email, password));

  console.log(`Casting ${voterCount} ballots at once…`);
  const cpuBefore = serverCpuMs();
  const started = performance.now();
  const results = await Promise.all(
    cookies.map(async (cookie, i) => {
      const t0 = performance.now();
      const ranking = [...candidates.slice(i % 3), ...candidates.slice(0, i % 3)];
      const reply = await call('PUT', `/shortlists/${shortlist.json.id}/ballot`, cookie, { ranking, concerns: [], comment: '' });
      return { status: reply.status, ms: performance.now() - t0 };
    }),
  );
  const wallMs = performance.now() - started;
  const cpuAfter = serverCpuMs();
  const failed = results.filter((r) => r.status !== 201);
  await call('POST', `/shortlists/${shortlist.json.id}/close`, architect, {});
  const tally = (await call('GET', `/shortlists/${shortlist.json.id}`, architect)).json.tally as { ballots: number; candidates: { borda: number }[] };
  const latencies = results.map((r) => r.ms).sort((a, b) => a - b);
  const points = tally.candidates.reduce((sum, c) => sum + c.borda, 0);
  console.log(`\nBallots: ${results.length} sent, ${results.length - failed.length} accepted, ${failed.length} refused; tally counts ${tally.ballots} (Borda points ${points}, expected ${voterCount * 3})`);
  console.log(`PUT /api/v1/shortlists/:id/ballot latency, ${voterCount} at once: p50 ${percentile(latencies, 50).toFixed(1)} ms, p95 ${percentile(latencies, 95).toFixed(1)} ms, p99 ${percentile(latencies, 99).toFixed(1)} ms, max ${latencies.at(-1)!.toFixed(1)} ms; all done in ${wallMs.toFixed(0)} ms`);
  if (cpuBefore !== null && cpuAfter !== null) console.log(`Server CPU time during the burst: ${cpuAfter - cpuBefore} ms (${((cpuAfter - cpuBefore) / voterCount).toFixed(1)} ms per ballot)`);
  console.log(`Load average (1, 5, 15 min): ${loadavg().map((l) => l.toFixed(2)).join(', ')} on this ${availableParallelism()}-core machine`);
  if (failed.length > 0 || tally.ballots !== voterCount || points !== voterCount * 3) {
    console.error('FAILED: ballots were lost, refused or double-counted');
    process.exitCode = 1;
  }
} finally {
  if (child) {
    child.kill('SIGTERM');
    await new Promise((r) => child!.once('exit', r));
  }
  if (dataDir) rmSync(dataDir, { recursive: true, force: true });
}
