#!/usr/bin/env node
// `npm run migrate`: applies drizzle/'s migrations to DATABASE_URL, once per release, before
// the new app nodes start (docs/deploy.md). Drizzle's migrator takes no lock, so two running at
// once could both apply a migration: one release job runs it, never each node. Point it at the
// database directly rather than through a transaction-mode pooler.
import { log, migrate } from './lib/stack.mjs';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set: say which database to migrate.');
  process.exit(2);
}
await migrate(url);
log('Migrations applied.');
