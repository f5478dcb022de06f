import { defineConfig } from 'drizzle-kit';

// `npm run db:generate` writes SQL migrations from server/db/schema into migrations/.
// drizzle-kit push and pull do not work against MariaDB: never depend on them.
export default defineConfig({
  dialect: 'mysql',
  schema: './server/db/schema/index.ts',
  out: './migrations',
  casing: 'snake_case',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'mysql://app@127.0.0.1:3306/rindwise' },
});
