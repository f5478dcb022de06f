// `node bench/compare-run.mjs`: Compare alone at community size (not part of `npm test`).
// Starts a throwaway MariaDB of its own, then bench/compare.ts fills it as `npm run bench`
// does and measures GET /api/compare with the read cache on and off. BENCH_QUICK=1 for a
// small smoke run. To measure an existing database instead, run bench/compare.ts with
// BENCH_DATABASE_URL set and BENCH_SKIP_FILL=1.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startPrivateDatabase } from '../scripts/lib/database.mjs';
import { ensureNodeModules } from '../scripts/lib/deps.mjs';
import { checkNode } from '../scripts/lib/node-check.mjs';
import { fail } from '../scripts/lib/say.mjs';
import { runTs } from '../scripts/lib/tsx.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
let database = null;
let tempDir = null;

async function main() {
  checkNode();
  await ensureNodeModules(root);
  tempDir = mkdtempSync(path.join(os.tmpdir(), 'rindwise-bench-compare-'));
  const started = await startPrivateDatabase({
    dir: path.join(tempDir, 'mariadb'),
    database: 'rindwise_bench',
    remember: false,
  });
  database = started.db;
  await runTs(
    root,
    'bench/compare.ts',
    process.argv.slice(2),
    { BENCH_DATABASE_URL: started.url, BENCH_TMP: tempDir },
    'The Compare benchmark',
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
