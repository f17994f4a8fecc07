// Build step (an Astro integration): writes dist/db-template.tar.gz, an embedded database that has been through
// PostgreSQL's initdb and every migration in ./drizzle. A server starting on an empty data folder unpacks it
// instead of running initdb itself (src/db/client.ts): on the 2-core test machine initdb took ~1.9–3 s of a
// first start and left ~740 MiB resident (PGlite's WebAssembly heap never shrinks); from the template the
// database opened in ~1.2 s at ~400 MiB. Without the file (astro dev, or a deleted dist) the server runs initdb.
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const TEMPLATE_FILE = 'db-template.tar.gz';

/** Creates the template in memory and returns it gzipped. */
export async function makeDatabaseTemplate(migrationsFolder) {
  const { PGlite } = await import('@electric-sql/pglite');
  const { drizzle } = await import('drizzle-orm/pglite');
  const { migrate } = await import('drizzle-orm/pglite/migrator');
  const client = await PGlite.create();
  try {
    await migrate(drizzle(client), { migrationsFolder });
    const blob = await client.dumpDataDir('gzip');
    return Buffer.from(await blob.arrayBuffer());
  } finally {
    await client.close();
  }
}

/** The Astro integration: after every production build, writes the template beside dist/server and dist/client. */
export function databaseTemplate() {
  let outDir = '';
  let root = '';
  return {
    name: 'resetwise:database-template',
    hooks: {
      'astro:config:done': ({ config }) => {
        outDir = fileURLToPath(config.outDir);
        root = fileURLToPath(config.root);
      },
      'astro:build:done': async ({ logger }) => {
        const t0 = performance.now();
        const bytes = await makeDatabaseTemplate(path.join(root, 'drizzle'));
        mkdirSync(outDir, { recursive: true });
        writeFileSync(path.join(outDir, TEMPLATE_FILE), bytes);
        logger.info(`database template: ${(bytes.length / 1024 / 1024).toFixed(1)} MiB in ${Math.round(performance.now() - t0)} ms`);
      },
    },
  };
}
