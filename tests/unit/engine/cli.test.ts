import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';

const ROOT = join(import.meta.dirname, '../../..');
const dir = mkdtempSync(join(tmpdir(), 'resetwise-cli-'));

function run(args: string[], stdin?: string): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync('npx', ['tsx', 'scripts/evaluate.ts', ...args], { cwd: ROOT, input: stdin, encoding: 'utf8', timeout: 60_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

function file(name: string, content: unknown): string {
  const p = join(dir, name);
  writeFileSync(p, typeof content === 'string' ? content : JSON.stringify(content));
  return p;
}

describe('evaluate CLI', () => {
  test('valid file → JSON comparison on stdout, exit 0', () => {
    const r = run(['examples/telecom-brick-36-75v-12v.json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect(out.results).toHaveLength(5);
    expect(out.ranking).toHaveLength(5);
    expect(out.input.vinMinV).toBe(36);
  });
  test('bad input → exit 2, one stderr line per problem naming field and reason, nothing on stdout', () => {
    const r = run([file('bad.json', { vinMinV: 400, vinNomV: 350, vinMaxV: 300, voutV: 12, ioutA: 1, fswHz: 1e5, extra: 1 })]);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toEqual(['extra is not a known field']);
    const r2 = run([file('bad2.json', { vinMinV: 400, vinNomV: 350, vinMaxV: 300, voutV: 12, ioutA: 1, fswHz: 1e5 })]);
    expect(r2.status).toBe(2);
    expect(r2.stdout).toBe('');
    expect(r2.stderr.trim()).toBe('vinMinV (400) must not exceed vinMaxV (300)');
  });
  test('invalid JSON and missing files → exit 2 with a message', () => {
    const r = run([file('broken.json', '{ not json')]);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/^input: not valid JSON/);
    expect(run([join(dir, 'missing.json')]).status).toBe(2);
  });
  test('- reads stdin; --scheme limits (repeatable)', () => {
    const spec = JSON.stringify({ vinMinV: 18, vinNomV: 24, vinMaxV: 32, voutV: 5, ioutA: 10, fswHz: 2e5 });
    const r = run(['-', '--scheme', 'two-switch', '--scheme', 'active-clamp'], spec);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).results.map((x: { scheme: string }) => x.scheme)).toEqual(['two-switch', 'active-clamp']);
    const bad = run(['-', '--scheme', 'flyback'], spec);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/--scheme flyback is not a known scheme/);
  });
  test('--csv prints a header and one row per scheme', () => {
    const r = run(['examples/industrial-24v-5v-50w.json', '--csv']);
    expect(r.status).toBe(0);
    const lines = r.stdout.trim().split('\n');
    expect(lines).toHaveLength(6);
    expect(lines[0]).toMatch(/^scheme,feasible,turnsRatio/);
    expect(lines[1]).toMatch(/^tertiary-winding,(true|false),/);
  });
  test('--parts uses another library (an empty one makes every scheme infeasible)', () => {
    const empty = { name: 'empty', version: '0', currency: 'EUR', mosfets: [], srMosfets: [], rectifiers: [], clampDiodes: [], gateDrivers: [], cores: [], capacitors: [], resistors: [], inductors: [] };
    const r = run(['examples/industrial-24v-5v-50w.json', '--parts', file('lib.json', empty)]);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.partsLibrary.name).toBe('empty');
    expect(out.results.every((x: { feasible: boolean }) => !x.feasible)).toBe(true);
    const bad = run(['examples/industrial-24v-5v-50w.json', '--parts', file('badlib.json', { name: 'x' })]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/parts.version must be a string/);
  });
});
