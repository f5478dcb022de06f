import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startPrivateDatabase } from '../../scripts/lib/database.mjs';
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
