// Runs once before the api and e2e layers: applies the migrations to the throwaway database
// that scripts/test.mjs started (DATABASE_URL).
import { createDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';

export default async function setup(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) {
    throw new Error(
      'DATABASE_URL is not set: run the api and e2e tests through `npm test`, which starts a throwaway MariaDB.',
    );
  }
  const handle = createDatabase(url, 2);
  try {
    await migrateDatabase(handle.db);
  } finally {
    await handle.close();
  }
}
