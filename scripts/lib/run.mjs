import { spawn } from 'node:child_process';

/**
 * Runs a command to completion with inherited output; resolves with its exit code.
 * Never rejects on a non-zero exit: callers decide what a failure means.
 */
export function run(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

/** Runs a command and captures its output; resolves with { code, stdout, stderr }. */
export function capture(command, args, options = {}) {
  return new Promise((resolve) => {
    const child = spawn(command, args, { stdio: ['ignore', 'pipe', 'pipe'], ...options });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => (stderr += d));
    child.on('error', (error) => resolve({ code: 127, stdout, stderr: String(error.message) }));
    child.on('exit', (code) => resolve({ code: code ?? 1, stdout, stderr }));
  });
}
