import { defineConfig } from 'drizzle-kit';

/** drizzle-kit reads this to generate the committed SQL migrations under `drizzle/`. */
export default defineConfig({
  dialect: 'sqlite',
  schema: './api/db/schema.ts',
  out: './drizzle',
  dbCredentials: { url: process.env['LOFTLINE_DB'] ?? 'data/loftline.db' },
});
