// Seeds the demo club on a fresh database: `node --import tsx server/cli/seed.ts [--accounts-file F]`.
import { writeFileSync } from 'node:fs';
import { loadConfig } from '../config';
import { createDatabase } from '../db/client';
import { seedDemo } from '../db/seed';
import { createLogger } from '../lib/logger';

const config = loadConfig();
const logger = createLogger(config.logLevel);
const handle = createDatabase(config.databaseUrl, 2);
const accountsFileIndex = process.argv.indexOf('--accounts-file');
try {
  const accounts = await seedDemo(handle.db, { uploadsDir: config.uploadsDir, logger });
  if (accountsFileIndex > 0) {
    const file = process.argv[accountsFileIndex + 1];
    writeFileSync(
      file,
      `${accounts.map((a) => `${a.role.padEnd(9)} ${a.email}  password: ${a.password}`).join('\n')}\n`,
    );
  }
  logger.info({ accounts: accounts.length }, 'demo data seeded');
} catch (error) {
  logger.error({ err: error }, 'seeding failed');
  process.exitCode = 1;
} finally {
  await handle.close();
}
