#!/usr/bin/env node
// `npm start`: builds when the sources are newer than the build, then serves the app.
// The server migrates the database (and seeds the demo workspace) on start.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
process.chdir(root);
process.env.ASTRO_TELEMETRY_DISABLED ??= '1';
const stamp = path.join(root, 'dist', '.built-at');

function newestMtime(entry) {
  const stat = statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return readdirSync(entry).reduce((newest, name) => Math.max(newest, newestMtime(path.join(entry, name))), stat.mtimeMs);
}

function needsBuild() {
  if (!existsSync(stamp) || !existsSync(path.join(root, 'dist/server/entry.mjs'))) return true;
  const built = statSync(stamp).mtimeMs;
  const inputs = ['src', 'public', 'astro.config.mjs', 'package-lock.json'].filter((p) => existsSync(p));
  return inputs.some((p) => newestMtime(p) > built);
}

if (needsBuild()) {
  console.log('Building Resetwise…');
  const result = spawnSync('npx', ['astro', 'build'], { stdio: 'inherit' });
  if (result.status !== 0) process.exit(result.status ?? 1);
  writeFileSync(stamp, new Date().toISOString());
}

process.env.HOST ??= '127.0.0.1';
process.env.PORT ??= '4321';
const { serve } = await import('./serve.mjs');
await serve();

const shownHost = process.env.HOST === '127.0.0.1' || process.env.HOST === '0.0.0.0' ? 'localhost' : process.env.HOST;
const url = `http://${shownHost}:${process.env.PORT}`;
for (let attempt = 0; attempt < 600; attempt++) {
  try {
    const response = await fetch(`http://127.0.0.1:${process.env.PORT}/api/v1/health`);
    if (response.ok) break;
  } catch {
    // not listening yet
  }
  await new Promise((resolve) => setTimeout(resolve, 100));
}
console.log(`\nResetwise is running at ${url}`);
console.log(`Data: ${process.env.DATABASE_URL ? 'PostgreSQL server (DATABASE_URL)' : path.resolve(process.env.DATA_DIR ?? './data')}`);
if (process.env.RESETWISE_DEMO !== '0') {
  const { demoLogins } = await import('./demo-logins.mjs');
  console.log('\nDemo workspace (fictional company and data). Sign in as:');
  for (const line of demoLogins()) console.log(`  ${line}`);
}
