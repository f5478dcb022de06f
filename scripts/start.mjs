// `npm start`: installs what is missing, starts the private MariaDB under .data/, applies the
// migrations, seeds the demo club on the first start, builds the client and serves the app.
// Node built-ins only until the npm packages are installed.
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureClientBuild } from './lib/build.mjs';
import { startPrivateDatabase } from './lib/database.mjs';
import { ensureNodeModules } from './lib/deps.mjs';
import { checkNode } from './lib/node-check.mjs';
import { isPortFree } from './lib/ports.mjs';
import { SetupError, fail, info, ok, step } from './lib/say.mjs';
import { localSecrets } from './lib/secrets.mjs';
import { runTs } from './lib/tsx.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dataRoot = path.join(root, '.data');
let database = null;
let server = null;
let stopping = false;

async function main() {
  checkNode();
  const port = Number(process.env.PORT ?? 3000);
  if (!(await isPortFree(port))) {
    throw new SetupError(
      `Port ${port} on 127.0.0.1 is already taken.`,
      'Stop whatever uses it, or run PORT=3100 npm start.',
    );
  }
  await ensureNodeModules(root);
  mkdirSync(dataRoot, { recursive: true });
  const { db, url } = await startPrivateDatabase({
    dir: path.join(dataRoot, 'mariadb'),
    database: 'rindwise',
    remember: true,
  });
  database = db;

  const secrets = localSecrets(path.join(dataRoot, 'secrets.json'));
  const env = {
    NODE_ENV: process.env.NODE_ENV ?? 'development',
    DATABASE_URL: process.env.DATABASE_URL ?? url,
    SESSION_SECRET: process.env.SESSION_SECRET ?? secrets.sessionSecret,
    UPLOADS_DIR: process.env.UPLOADS_DIR ?? path.join(root, 'uploads'),
    PORT: String(port),
    PUBLIC_URL: process.env.PUBLIC_URL ?? `http://127.0.0.1:${port}`,
  };

  step('Applying database migrations…');
  await runTs(root, 'server/cli/migrate.ts', [], env, 'Applying the migrations');
  const seededMark = path.join(dataRoot, 'demo-seeded');
  if (!existsSync(seededMark)) {
    step('Seeding the demo club (first start only)…');
    await runTs(
      root,
      'server/cli/seed.ts',
      ['--accounts-file', path.join(dataRoot, 'demo-accounts.txt')],
      env,
      'Seeding',
    );
    writeFileSync(seededMark, `${new Date().toISOString()}\n`);
  }
  await ensureClientBuild(root);

  step('Starting the web server…');
  server = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/index.ts')], {
    cwd: root,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  server.once('exit', (code, signal) => {
    server = null;
    if (!stopping) {
      process.stderr.write(`The web server stopped unexpectedly (${code ?? signal}).\n`);
      shutdown(1);
    }
  });
  await waitForHealth(`http://127.0.0.1:${port}/api/health`);
  ok(`Rindwise is serving at http://127.0.0.1:${port}`);
  const accounts = path.join(dataRoot, 'demo-accounts.txt');
  if (existsSync(accounts)) {
    info('Demo sign-in accounts:');
    for (const line of readFileSync(accounts, 'utf8').trim().split('\n')) info(`  ${line}`);
  }
  info('Press Ctrl-C to stop the server and its database.');
}

async function waitForHealth(url) {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (!server)
      throw new SetupError('The web server exited during start-up.', 'See its log lines above.');
    try {
      const response = await fetch(url);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new SetupError(
    'The web server did not answer /api/health within 60 s.',
    'See its log lines above.',
  );
}

async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  if (server) {
    const exited = new Promise((resolve) => server.once('exit', resolve));
    server.kill('SIGTERM');
    await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 15_000))]);
    if (server) server.kill('SIGKILL');
  }
  if (database) {
    step('Stopping the private MariaDB…');
    await database.stop();
    ok('stopped');
  }
  process.exit(code);
}

process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

main().catch((error) => {
  fail(error);
  shutdown(1);
});
