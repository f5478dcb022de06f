import path from 'node:path';
import { run } from './run.mjs';
import { SetupError } from './say.mjs';

/** Runs a TypeScript entry point of the project with tsx; throws on a non-zero exit. */
export async function runTs(root, entry, args, env, what) {
  const code = await run(process.execPath, ['--import', 'tsx', path.join(root, entry), ...args], {
    cwd: root,
    env: { ...process.env, ...env },
  });
  if (code !== 0) throw new SetupError(`${what} failed (exit ${code}).`, 'See the messages above.');
}
