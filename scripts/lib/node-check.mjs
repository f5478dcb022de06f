import { SetupError } from './say.mjs';

/** Fails early, with a plain message, on a Node.js older than the one the stack needs. */
export function checkNode() {
  const [major, minor] = process.versions.node.split('.').map(Number);
  if (major < 20 || (major === 20 && minor < 19)) {
    throw new SetupError(
      `Rindwise needs Node.js 20.19 or newer; this is ${process.versions.node}.`,
      'Install a current Node.js 20 LTS and run the command again.',
    );
  }
}
