import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'sqlite',
  schema: './server/dist/db/schema/index.js',
  out: './server/drizzle',
  strict: true,
  verbose: true,
});
