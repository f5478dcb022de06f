import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';

/** Reads dir/secrets.json, creating it with a fresh session secret the first time. */
export function localSecrets(file) {
  if (existsSync(file)) return JSON.parse(readFileSync(file, 'utf8'));
  const secrets = { sessionSecret: randomBytes(32).toString('base64url') };
  writeFileSync(file, `${JSON.stringify(secrets, null, 2)}\n`, { mode: 0o600 });
  return secrets;
}
