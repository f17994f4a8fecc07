// Lines for the console: the demo accounts as the app seeds them (read from the source file,
// so the list cannot drift from what is seeded).
import { readFileSync } from 'node:fs';

export function demoLogins() {
  const source = readFileSync(new URL('../src/demo/accounts.ts', import.meta.url), 'utf8');
  const password = /DEMO_PASSWORD = '([^']+)'/.exec(source)?.[1] ?? '';
  const rows = [...source.matchAll(/email: '([^']+)', displayName: '([^']+)', role: '([^']+)'/g)];
  return [...rows.map(([, email, , role]) => `${role.padEnd(10)} ${email}`), `password   ${password}`];
}
