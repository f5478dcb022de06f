// Applies the migrations and reference data: `node --import tsx server/cli/migrate.ts`.
import { loadConfig } from '../config';
import { createDatabase } from '../db/client';
import { migrateDatabase } from '../db/migrate';
import { createLogger } from '../lib/logger';

const config = loadConfig();
const logger = createLogger(config.logLevel);
const handle = createDatabase(config.databaseUrl, 2);
try {
  await migrateDatabase(handle.db);
  logger.info('migrations applied');
} catch (error) {
  logger.error({ err: error }, 'migration failed');
  process.exitCode = 1;
} finally {
  await handle.close();
}
