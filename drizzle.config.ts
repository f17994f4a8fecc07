import { defineConfig } from 'drizzle-kit';

// Generation only reads the schema; it never connects to the live data folder.
export default defineConfig({
  dialect: 'postgresql',
  schema: './src/db/schema.ts',
  out: './drizzle',
  casing: 'snake_case',
});
