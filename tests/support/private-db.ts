import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { SCRATCH_DATABASE_NAMES, startPrivateDatabase } from '../../scripts/lib/database.mjs';
import type { PrivateMariaDb } from '../../scripts/lib/mariadb.mjs';
import { createDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';

export type ThrowawayDatabase = {
  /** The instance itself, to stop, kill or restart it. */
  server: PrivateMariaDb;
  url: string;
  dir: string;
  /** Stops the instance and removes its data directory. */
  stop: () => Promise<void>;
};

/**
 * A MariaDB instance of this test file's own (its own data directory and port, migrated),
 * for tests that kill the server or must not share rows with the other files; migrated
 * unless told otherwise (a restore wants an empty database).
 */
export async function startThrowawayDatabase(
  name = 'rindwise_private',
  { migrate = true }: { migrate?: boolean } = {},
): Promise<ThrowawayDatabase> {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'rindwise-db-'));
  const start = (sub: string) =>
    startPrivateDatabase({ dir: path.join(dir, sub), database: name, remember: false });
  // mariadb-install-db shares /tmp with every other test run on the machine and now and
  // then trips over a temporary file; a second try in a fresh folder gets through.
  const { db: server, url } = await start('mariadb').catch(() => start('mariadb-2'));
  if (migrate) {
    const handle = createDatabase(url, 2);
    try {
      await migrateDatabase(handle.db);
    } finally {
      await handle.close();
    }
  }
  return {
    server,
    url,
    dir,
    stop: async () => {
      await server.stop();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export type OwnDatabase = { url: string; stop: () => Promise<void> };

/**
 * A database of this test file's own, for tests that must not share rows with the other
 * files but never kill the server: an empty database that `npm test` made in its MariaDB for
 * this name (SCRATCH_DATABASE_URLS; seconds instead of a new instance's half a minute), or a
 * private instance when the tests run some other way. Migrated unless told otherwise.
 */
export async function ownDatabase(
  name: (typeof SCRATCH_DATABASE_NAMES)[number],
  { migrate = true }: { migrate?: boolean } = {},
): Promise<OwnDatabase> {
  const urls = JSON.parse(process.env.SCRATCH_DATABASE_URLS ?? '{}') as Record<string, string>;
  const url = urls[name];
  if (!url) return startThrowawayDatabase(name, { migrate });
  if (migrate) {
    const handle = createDatabase(url, 2);
    try {
      await migrateDatabase(handle.db);
    } finally {
      await handle.close();
    }
  }
  // The run's MariaDB, with this database in it, goes away when the run ends.
  return { url, stop: async () => {} };
}
