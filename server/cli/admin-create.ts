// Creates the first admin, or promotes an existing member:
//   npm run admin:create -- --email you@example.org [--name "Your Name"] [--handle you] [--password ...]
// Without --password a strong one is generated and printed once.
import { randomBytes } from 'node:crypto';
import { parseArgs } from 'node:util';
import { emailSchema, handleSchema } from '../../shared/schemas/auth';
import { assessPassword } from '../../shared/security/password-strength';
import { loadConfig } from '../config';
import { createDatabase } from '../db/client';
import { hashPassword } from '../lib/passwords';
import {
  findUserByEmail,
  findUserByHandle,
  insertUser,
  updateUser,
} from '../repositories/users.repository';

const { values } = parseArgs({
  options: {
    email: { type: 'string' },
    name: { type: 'string' },
    handle: { type: 'string' },
    password: { type: 'string' },
  },
});

function exit(message: string): never {
  process.stderr.write(`${message}\n`);
  process.exit(1);
}

const email = emailSchema.safeParse(values.email ?? '');
if (!email.success) exit('Give the admin e-mail: npm run admin:create -- --email you@example.org');

const handle = handleSchema.safeParse(
  values.handle ??
    email.data
      .split('@')[0]
      .replace(/[^a-z0-9_-]/g, '-')
      .slice(0, 32),
);
if (!handle.success)
  exit(`That handle is not usable (${handle.error.issues[0].message}); pass --handle.`);

const password = values.password ?? randomBytes(18).toString('base64url');
if (values.password && !assessPassword(password, [email.data]).acceptable) {
  exit(
    'That password is too easy to guess; choose a longer one or leave --password out to get a generated one.',
  );
}

const config = loadConfig();
const handleDb = createDatabase(config.databaseUrl, 2);
try {
  const db = handleDb.db;
  const existing = await findUserByEmail(db, email.data);
  if (existing) {
    await updateUser(db, existing.id, {
      role: 'admin',
      emailVerifiedAt: existing.emailVerifiedAt ?? new Date(),
      disabledAt: null,
    });
    process.stdout.write(`@${existing.handle} (${existing.email}) is now an admin.\n`);
  } else {
    if (await findUserByHandle(db, handle.data))
      exit(`The handle @${handle.data} is taken; pass --handle.`);
    await insertUser(db, {
      email: email.data,
      handle: handle.data,
      displayName: values.name ?? handle.data,
      passwordHash: await hashPassword(password),
      role: 'admin',
      emailVerifiedAt: new Date(),
    });
    process.stdout.write(`Admin @${handle.data} (${email.data}) created.\n`);
    if (!values.password)
      process.stdout.write(`Password (shown once, change it after signing in): ${password}\n`);
  }
} finally {
  await handleDb.close();
}
