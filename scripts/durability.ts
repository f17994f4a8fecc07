// `npm run durability [-- ROUNDS [SIGTERM]]`: starts the built server on a temporary data folder, runs
// concurrent writes (spec saves, ballots, new members), kills the server with SIGKILL (or stops it with
// SIGTERM, which must end in exit code 0) in the middle, restarts it on the same folder and checks that
// every write that got a 2xx reply is there and that the data is consistent. RESETWISE_DIST names
// another build folder.
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export interface DurabilityReport {
  rounds: number;
  acknowledged: { specSaves: number; ballots: number; members: number };
  unacknowledged: number;
  problems: string[];
}

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

async function boot(dataDir: string, port: number): Promise<ChildProcess> {
  // scripts/serve.mjs serves the build in RESETWISE_DIST (default dist/).
  const child = spawn(process.execPath, ['scripts/serve.mjs'], { env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), DATA_DIR: dataDir, RESETWISE_DEMO: '1', DATABASE_URL: '' }, stdio: 'ignore' });
  for (let i = 0; i < 600; i++) {
    try { if ((await fetch(`http://127.0.0.1:${port}/api/v1/health`)).ok) return child; } catch { /* starting */ }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('server did not start');
}

/** Runs `rounds` kill-and-restart rounds; returns what was checked and any problem found. */
export async function runDurability(rounds = 2, signal: 'SIGKILL' | 'SIGTERM' = 'SIGKILL'): Promise<DurabilityReport> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'resetwise-durability-'));
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const report: DurabilityReport = { rounds, acknowledged: { specSaves: 0, ballots: 0, members: 0 }, unacknowledged: 0, problems: [] };
  const call = async (method: string, route: string, cookie?: string, body?: unknown) => {
    const r = await fetch(`${base}/api/v1${route}`, { method, headers: { 'content-type': 'application/json', origin: base, ...(cookie ? { cookie } : {}) }, ...(body !== undefined ? { body: JSON.stringify(body) } : {}) });
    const set = r.headers.getSetCookie().find((c) => c.startsWith('rw_session='));
    return { status: r.status, json: await r.json().catch(() => null) as any, cookie: set?.split(';')[0] };
  };
  const signIn = async (email: string, password = 'resetwise-demo') => (await call('POST', '/auth/sign-in', undefined, { email, password })).cookie!;

  let server = await boot(dataDir, port);
  try {
    const admin = await signIn('admin@resetwise.example');
    const architect = await signIn('architect@resetwise.example');
    // A shortlist open to twelve new voters.
    const voters: { id: string; email: string; cookie?: string }[] = [];
    for (let i = 0; i < 12; i++) {
      const created = await call('POST', '/users', admin, { email: `durable${i}@halvard.example`, name: `Durable ${i}`, role: 'engineer', password: 'durable-password' });
      voters.push({ id: created.json.id, email: created.json.email });
    }
    const shortlist = (await call('POST', '/shortlists', architect, { specId: 'demo-spec-3', title: 'Durability' })).json.id as string;
    const candidates: string[] = [];
    for (const scheme of ['two-switch', 'active-clamp', 'rcd-clamp']) candidates.push((await call('POST', `/shortlists/${shortlist}/candidates`, architect, { scheme })).json.id);
    await call('POST', `/shortlists/${shortlist}/open`, architect, { deadline: new Date(Date.now() + 86_400_000).toISOString(), voterIds: voters.map((v) => v.id) });

    const ackedBallot = new Map<string, string[][]>(); // voter → rankings sent, acked or not, in order
    const lastAckedBallot = new Map<string, number>();
    let lastAckedSpec: { version: number; vinMaxV: number } | undefined;
    const ackedMembers: string[] = [];
    let memberSeq = 0;

    for (let round = 0; round < rounds; round++) {
      for (const v of voters) v.cookie = await signIn(v.email, 'durable-password');
      const architectNow = await signIn('architect@resetwise.example');
      const adminNow = await signIn('admin@resetwise.example');
      let stop = false;
      const specWriter = (async () => {
        while (!stop) {
          const spec = await call('GET', '/specs/demo-spec-3', architectNow).catch(() => undefined);
          if (!spec || spec.status !== 200) return;
          const vinMaxV = 30 + Math.round(Math.random() * 40) / 10;
          const saved = await call('PUT', '/specs/demo-spec-3', architectNow, { version: spec.json.version, name: spec.json.name, customer: spec.json.customer, requirements: { ...spec.json.requirements, vinMaxV } }).catch(() => undefined);
          if (saved?.status === 200) { lastAckedSpec = { version: saved.json.version, vinMaxV }; report.acknowledged.specSaves++; }
          else report.unacknowledged++;
        }
      })();
      const ballotWriters = voters.map(async (v, i) => {
        let n = 0;
        while (!stop) {
          const ranking = [...candidates.slice((i + n) % 3), ...candidates.slice(0, (i + n) % 3)];
          n++;
          const sent = ackedBallot.get(v.id) ?? [];
          sent.push(ranking);
          ackedBallot.set(v.id, sent);
          const reply = await call('PUT', `/shortlists/${shortlist}/ballot`, v.cookie, { ranking, concerns: [], comment: `round ${round} #${n}` }).catch(() => undefined);
          if (reply && reply.status < 300) { lastAckedBallot.set(v.id, sent.length - 1); report.acknowledged.ballots++; }
          else report.unacknowledged++;
        }
      });
      const memberWriter = (async () => {
        while (!stop) {
          const email = `member${memberSeq++}@halvard.example`;
          const reply = await call('POST', '/users', adminNow, { email, name: email, role: 'sales', password: 'member-password' }).catch(() => undefined);
          if (reply?.status === 201) { ackedMembers.push(email); report.acknowledged.members++; }
          else report.unacknowledged++;
        }
      })();
      // Let writes get going (some acknowledged of each kind, up to 20 s on a slow machine), then kill mid-stream.
      const startAcks = { ...report.acknowledged };
      for (let waited = 0; waited < 20_000; waited += 100) {
        const a = report.acknowledged;
        if (waited >= 1500 && a.ballots - startAcks.ballots >= 10 && a.specSaves > startAcks.specSaves && a.members > startAcks.members) break;
        await new Promise((r) => setTimeout(r, 100));
      }
      await new Promise((r) => setTimeout(r, Math.random() * 300));
      const exited = server.exitCode === null && server.signalCode === null ? once(server, 'exit') : Promise.resolve([server.exitCode]);
      server.kill(signal); // in the middle of the writes
      stop = true;
      await Promise.allSettled([specWriter, memberWriter, ...ballotWriters]);
      const [code] = await exited;
      if (signal === 'SIGTERM' && code !== 0) report.problems.push(`round ${round}: the server exited with ${String(code)} after SIGTERM, not 0`);
      server = await boot(dataDir, port);

      // Every acknowledged write must be there.
      const checker = await signIn('architect@resetwise.example');
      const spec = await call('GET', '/specs/demo-spec-3', checker);
      if (lastAckedSpec && spec.json.version < lastAckedSpec.version) report.problems.push(`round ${round}: spec at version ${spec.json.version}, but version ${lastAckedSpec.version} was acknowledged`);
      if (lastAckedSpec && spec.json.version === lastAckedSpec.version && spec.json.requirements.vinMaxV !== lastAckedSpec.vinMaxV) report.problems.push(`round ${round}: spec version ${spec.json.version} holds vinMaxV ${spec.json.requirements.vinMaxV}, acknowledged ${lastAckedSpec.vinMaxV}`);
      const adminCheck = await signIn('admin@resetwise.example');
      const members = new Set(((await call('GET', '/users', adminCheck)).json.users as { email: string }[]).map((u) => u.email));
      for (const email of ackedMembers) if (!members.has(email)) report.problems.push(`round ${round}: acknowledged member ${email} is missing`);
      // A voter's stored ballot is the last acknowledged one or one sent after it (sent, not yet acknowledged).
      const view = await call('GET', `/shortlists/${shortlist}`, await signIn(voters[0]!.email, 'durable-password'));
      if (view.status !== 200) report.problems.push(`round ${round}: shortlist unreadable after restart (${view.status})`);
      for (const v of voters) {
        const last = lastAckedBallot.get(v.id);
        if (last === undefined) continue;
        const mine = (await call('GET', `/shortlists/${shortlist}`, await signIn(v.email, 'durable-password'))).json.myBallot;
        const sent = ackedBallot.get(v.id)!;
        const allowed = sent.slice(last).map((r) => JSON.stringify(r));
        if (!mine || !allowed.includes(JSON.stringify(mine.ranking))) report.problems.push(`round ${round}: ${v.email}'s acknowledged ballot is missing or older`);
      }
      if (view.json.tally && view.json.tally.ballots !== new Set([...lastAckedBallot.keys()]).size) {
        report.problems.push(`round ${round}: tally counts ${view.json.tally.ballots} ballots for ${lastAckedBallot.size} voters who voted`);
      }
    }
  } finally {
    server.kill('SIGKILL');
    await new Promise((r) => setTimeout(r, 200));
    rmSync(dataDir, { recursive: true, force: true });
  }
  return report;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  const signal = process.argv[3] === 'SIGTERM' ? 'SIGTERM' : 'SIGKILL';
  const report = await runDurability(Number(process.argv[2] ?? 3), signal);
  console.log(`Durability: ${report.rounds} ${signal} rounds; acknowledged ${report.acknowledged.specSaves} spec saves, ${report.acknowledged.ballots} ballots, ${report.acknowledged.members} new members; ${report.unacknowledged} writes cut off unacknowledged`);
  for (const problem of report.problems) console.error(`LOST: ${problem}`);
  console.log(report.problems.length === 0 ? 'Every acknowledged write survived.' : `${report.problems.length} problem(s).`);
  process.exitCode = report.problems.length === 0 ? 0 : 1;
}
