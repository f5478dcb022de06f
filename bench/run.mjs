// `npm run bench`: the community-size benchmarks (not part of `npm test`). Starts a throwaway
// MariaDB of its own (as the tests do), builds the client if needed, then runs bench/bench.ts,
// which fills the database, measures the API with autocannon and the pages in Chromium, prints
// a table and writes bench/results/latest.json. Set BENCH_QUICK=1 for a small smoke run.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureClientBuild } from '../scripts/lib/build.mjs';
import { startPrivateDatabase } from '../scripts/lib/database.mjs';
import { ensureChromium, ensureNodeModules } from '../scripts/lib/deps.mjs';
import { checkNode } from '../scripts/lib/node-check.mjs';
import { fail } from '../scripts/lib/say.mjs';
import { runTs } from '../scripts/lib/tsx.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
let database = null;
let tempDir = null;

async function main() {
  checkNode();
  await ensureNodeModules(root);
  const chromium = await ensureChromium();
  // BENCH_CLIENT_DIST: a client build of one's own (vite build --outDir), served as it is.
  if (!process.env.BENCH_CLIENT_DIST) await ensureClientBuild(root);
  tempDir = mkdtempSync(path.join(os.tmpdir(), 'rindwise-bench-'));
  const started = await startPrivateDatabase({
    dir: path.join(tempDir, 'mariadb'),
    database: 'rindwise_bench',
    remember: false,
  });
  database = started.db;
  await runTs(
    root,
    'bench/bench.ts',
    process.argv.slice(2),
    {
      BENCH_DATABASE_URL: started.url,
      BENCH_DB_SOCKET: started.db.socket,
      BENCH_DB_CLIENT: started.db.bin.client,
      BENCH_TMP: tempDir,
      CHROMIUM_PATH: chromium,
    },
    'The benchmark',
  );
}

async function cleanup() {
  if (database) await database.stop();
  if (tempDir) rmSync(tempDir, { recursive: true, force: true });
}

process.on('SIGINT', () => cleanup().then(() => process.exit(130)));
main()
  .then(cleanup)
  .catch(async (error) => {
    fail(error);
    await cleanup();
    process.exit(1);
  });
