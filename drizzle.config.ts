import { defineConfig } from 'drizzle-kit';

// drizzle-kit generates SQL migrations from src/db/schema.ts into drizzle/.
// `npm run db:generate` needs no database; migrations are applied by scripts/lib/stack.mjs.
export default defineConfig({
  dialect: 'postgresql',
  schema: './src/db/schema.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/groundwork' },
});
