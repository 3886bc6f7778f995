import { defineConfig } from 'drizzle-kit';

// Only `drizzle-kit generate` is used: migrations are applied by drizzle's migrator at start
// (drizzle-kit migrate/push misbehave on MariaDB, see DEVELOPERS.md).
export default defineConfig({
  dialect: 'mysql',
  schema: './server/db/schema/index.ts',
  out: './drizzle',
  casing: 'snake_case',
});
