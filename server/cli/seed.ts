// Seeds the demo club on a fresh database: `node --import tsx server/cli/seed.ts [--accounts-file F]`.
import { writeFileSync } from 'node:fs';
import { loadConfig } from '../config';
import { createContext } from '../context';
import { seedDemo } from '../db/seed';

const config = loadConfig();
const ctx = await createContext(config);
const accountsFileIndex = process.argv.indexOf('--accounts-file');
try {
  const started = Date.now();
  const accounts = await seedDemo(ctx);
  if (accountsFileIndex > 0) {
    const file = process.argv[accountsFileIndex + 1];
    writeFileSync(
      file,
      `${accounts.map((a) => `${a.role.padEnd(9)} ${a.email}  password: ${a.password}`).join('\n')}\n`,
    );
  }
  ctx.logger.info({ accounts: accounts.length, ms: Date.now() - started }, 'demo data seeded');
} catch (error) {
  ctx.logger.error({ err: error }, 'seeding failed');
  process.exitCode = 1;
} finally {
  await ctx.close();
}
