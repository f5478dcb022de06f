// `npm run dev`: the private MariaDB under .data/, the Express server in watch mode on
// API_PORT (default 3001) and the Vite dev server on PORT (default 3000) proxying /api to it.
import { spawn } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startPrivateDatabase } from './lib/database.mjs';
import { ensureNodeModules } from './lib/deps.mjs';
import { checkNode } from './lib/node-check.mjs';
import { fail, ok } from './lib/say.mjs';
import { localSecrets } from './lib/secrets.mjs';
import { runTs } from './lib/tsx.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dataRoot = path.join(root, '.data');
const children = [];
let database = null;
let stopping = false;

async function main() {
  checkNode();
  await ensureNodeModules(root);
  mkdirSync(dataRoot, { recursive: true });
  const { db, url } = await startPrivateDatabase({
    dir: path.join(dataRoot, 'mariadb'),
    database: 'rindwise',
    remember: true,
  });
  database = db;
  const port = process.env.PORT ?? '3000';
  const apiPort = process.env.API_PORT ?? '3001';
  const env = {
    ...process.env,
    NODE_ENV: 'development',
    DATABASE_URL: process.env.DATABASE_URL ?? url,
    SESSION_SECRET: localSecrets(path.join(dataRoot, 'secrets.json')).sessionSecret,
    UPLOADS_DIR: process.env.UPLOADS_DIR ?? path.join(root, 'uploads'),
    PORT: apiPort,
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    SERVE_CLIENT: 'false',
  };
  await runTs(root, 'server/cli/migrate.ts', [], env, 'Applying the migrations');
  const spawnChild = (args, extraEnv = {}) => {
    const child = spawn(process.execPath, args, {
      cwd: root,
      env: { ...env, ...extraEnv },
      stdio: 'inherit',
    });
    child.once('exit', () => shutdown(0));
    children.push(child);
  };
  spawnChild(['--import', 'tsx', '--watch', path.join(root, 'server/index.ts')]);
  spawnChild(
    [path.join(root, 'node_modules/vite/bin/vite.js'), '--port', port, '--host', '127.0.0.1'],
    {
      API_TARGET: `http://127.0.0.1:${apiPort}`,
    },
  );
  ok(`dev servers starting: http://127.0.0.1:${port} (API on ${apiPort})`);
}

async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  for (const child of children) child.kill('SIGTERM');
  await new Promise((resolve) => setTimeout(resolve, 500));
  if (database) await database.stop();
  process.exit(code);
}

process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));
main().catch((error) => {
  fail(error);
  shutdown(1);
});
