import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { run } from './run.mjs';
import { SetupError, ok, step } from './say.mjs';

const INPUTS = ['client', 'shared', 'index.html', 'vite.config.ts', 'package-lock.json', 'public'];

function hashTree(root) {
  const hash = createHash('sha256');
  const visit = (rel) => {
    const full = path.join(root, rel);
    if (!existsSync(full)) return;
    const stat = statSync(full);
    if (stat.isDirectory()) {
      for (const name of readdirSync(full).sort()) visit(path.join(rel, name));
    } else {
      hash.update(rel);
      hash.update(readFileSync(full));
    }
  };
  INPUTS.forEach(visit);
  return hash.digest('hex');
}

/** Builds the client with Vite unless dist/ already holds a build of the same sources. */
export async function ensureClientBuild(root, { force = false } = {}) {
  const stamp = path.join(root, 'dist', '.source-hash');
  const wanted = hashTree(root);
  if (!force && existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === wanted) return;
  step('Building the client (vite build)…');
  const code = await run(
    process.execPath,
    [path.join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'],
    {
      cwd: root,
    },
  );
  if (code !== 0)
    throw new SetupError(`vite build failed (exit ${code}).`, 'See the build errors above.');
  writeFileSync(stamp, `${wanted}\n`);
  ok('client built into dist/');
}
