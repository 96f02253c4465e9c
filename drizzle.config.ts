import { defineConfig } from 'drizzle-kit';

// `npm run db:generate` writes reviewed SQL migrations into drizzle/ (committed).
// Generation only diffs the schema files; it needs no database connection.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema/index.ts',
  out: './drizzle',
  casing: 'snake_case',
});
