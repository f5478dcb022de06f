// `npm test`: the same set-up as `npm start`, but with a throwaway MariaDB (its own temporary
// data directory and port, removed afterwards), then lint, type checks, the client build and
// every vitest layer (unit, api, e2e). Exits non-zero on any failure.
// Extra arguments go to vitest, e.g. `npm test -- --project unit`.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureClientBuild } from './lib/build.mjs';
import { SCRATCH_DATABASE_NAMES, addDatabase, startPrivateDatabase } from './lib/database.mjs';
import { ensureChromium, ensureNodeModules } from './lib/deps.mjs';
import { checkNode } from './lib/node-check.mjs';
import { run } from './lib/run.mjs';
import { fail, ok, step } from './lib/say.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const vitestArgs = process.argv.slice(2);
const quick = vitestArgs.length > 0; // a focused run skips lint and type checks
let database = null;
let tempDir = null;
let cleaned = false;

async function cleanup() {
  if (cleaned) return;
  cleaned = true;
  if (database) await database.stop();
  if (tempDir) rmSync(tempDir, { recursive: true, force: true });
}

async function main() {
  checkNode();
  await ensureNodeModules(root);
  const chromium = await ensureChromium();
  tempDir = mkdtempSync(path.join(os.tmpdir(), 'rindwise-test-'));
  const started = await startPrivateDatabase({
    dir: path.join(tempDir, 'mariadb'),
    database: 'rindwise_test',
    remember: false,
  });
  database = started.db;
  // A second, empty database for the test that seeds the demo club from scratch.
  const seedUrl = await addDatabase(started.db, 'rindwise_seed_test');
  // Empty databases for the test files that want one of their own (ownDatabase() in
  // tests/support/private-db.ts): far quicker than a MariaDB instance each.
  const scratch = {};
  for (const name of SCRATCH_DATABASE_NAMES) scratch[name] = await addDatabase(started.db, name);

  const bin = (name) => path.join(root, 'node_modules/.bin', name);
  const failures = [];
  const stage = async (name, command, args, env = {}) => {
    step(name);
    const code = await run(command, args, { cwd: root, env: { ...process.env, ...env } });
    if (code === 0) ok(name);
    else failures.push(`${name} (exit ${code})`);
    return code;
  };

  if (!quick) {
    await stage('Lint (ESLint)', bin('eslint'), ['.']);
    await stage('Formatting (Prettier)', bin('prettier'), ['--check', '.']);
    await stage('Type check: client (vue-tsc)', bin('vue-tsc'), [
      '--noEmit',
      '-p',
      'tsconfig.app.json',
    ]);
    await stage('Type check: server (tsc)', bin('tsc'), ['--noEmit', '-p', 'tsconfig.server.json']);
  }
  // A focused run without the browser layer needs no client build.
  const needsBuild = !quick || vitestArgs.some((arg) => arg.includes('e2e'));
  if (needsBuild) await ensureClientBuild(root);

  const uploads = path.join(tempDir, 'uploads');
  mkdirSync(uploads, { recursive: true });
  const env = {
    NODE_ENV: 'test',
    UPLOADS_DIR: uploads,
    CHROMIUM_PATH: chromium,
    CLIENT_DIST: path.join(root, 'dist'),
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'silent',
    SEED_DATABASE_URL: seedUrl,
    SCRATCH_DATABASE_URLS: JSON.stringify(scratch),
  };
  // A full run gives the browser journeys a database of their own, so the rows the API tests
  // leave behind never push a journey's journal off the first page of a list.
  const runs = quick
    ? [{ name: 'Tests (vitest)', args: vitestArgs, url: started.url }]
    : [
        {
          name: 'Tests (vitest: unit, api)',
          args: ['--project', 'unit', '--project', 'api'],
          url: started.url,
        },
        {
          name: 'Tests (vitest: e2e)',
          args: ['--project', 'e2e'],
          url: await addDatabase(started.db, 'rindwise_e2e_test'),
        },
      ];
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  for (const [i, r] of runs.entries()) {
    const report = path.join(tempDir, `vitest-${i}.json`);
    await stage(
      r.name,
      bin('vitest'),
      ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...r.args],
      {
        ...env,
        DATABASE_URL: r.url,
      },
    );
    if (existsSync(report)) {
      const summary = JSON.parse(readFileSync(report, 'utf8'));
      passed += summary.numPassedTests;
      failed += summary.numFailedTests;
      skipped += summary.numPendingTests;
    }
  }
  process.stdout.write(
    `\nvitest: ${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}\n`,
  );

  if (failures.length) {
    process.stderr.write(`\nFailed: ${failures.join('; ')}\n`);
    return 1;
  }
  ok('everything passed');
  return 0;
}

const onSignal = () => cleanup().then(() => process.exit(130));
process.on('SIGINT', onSignal);
process.on('SIGTERM', onSignal);

main()
  .then(async (code) => {
    await cleanup();
    process.exit(code);
  })
  .catch(async (error) => {
    fail(error);
    await cleanup();
    process.exit(1);
  });
