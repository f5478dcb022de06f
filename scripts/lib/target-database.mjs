import { existsSync } from 'node:fs';
import path from 'node:path';
import { startPrivateDatabase } from './database.mjs';
import { SetupError } from './say.mjs';

/**
 * The database a maintenance script works on: DATABASE_URL when set, else the private
 * instance of `npm start` under .data/ (started for the script if it is not running, and
 * stopped again by release()). With mustExist, a missing .data instance is an error.
 */
export async function targetDatabase(root, { mustExist }) {
  if (process.env.DATABASE_URL) {
    return { url: process.env.DATABASE_URL, where: 'DATABASE_URL', release: async () => {} };
  }
  const dir = path.join(root, '.data/mariadb');
  if (mustExist && !existsSync(path.join(dir, 'credentials.json'))) {
    throw new SetupError(
      'DATABASE_URL is not set and there is no local database under .data/ yet.',
      'Run `npm start` once, or set DATABASE_URL.',
    );
  }
  const { db, url } = await startPrivateDatabase({ dir, database: 'rindwise', remember: true });
  const startedHere = Boolean(db.child);
  return {
    url,
    where: 'the private database under .data/',
    release: async () => {
      if (startedHere) await db.stop();
    },
  };
}
