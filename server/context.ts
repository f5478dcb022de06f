import path from 'node:path';
import type { Logger } from 'pino';
import type { AppConfig } from './config';
import { createDatabase, type DatabaseHandle } from './db/client';
import { createLimiters, type Limiters } from './lib/rate-limit';
import { createLogger } from './lib/logger';
import { startReadCacheSync, type ReadCacheSync } from './lib/read-cache-sync';
import { TtlCache } from './lib/ttl-cache';
import { S3Storage } from './lib/s3-storage';
import { LocalStorage, type PhotoStorage } from './lib/storage';
import { LocalMailbox } from './mail/local-mailbox';
import { Mailer } from './mail/mailer';

/** What the routers and services share: config, logger, database, mail, rate limits, storage. */
export type AppContext = {
  config: AppConfig;
  logger: Logger;
  database: DatabaseHandle;
  mailer: Mailer;
  /** The local mail fake; null in production or when SMTP_URL names a real relay. */
  mailbox: LocalMailbox | null;
  limiters: Limiters;
  /** Where photo renditions are stored: UPLOADS_DIR/photos, or an S3 bucket (STORAGE=s3). */
  storage: PhotoStorage;
  /**
   * Answers that do not depend on who asks (public Discover pages, Compare for signed-out
   * visitors), reused for READ_CACHE_SECONDS; cleared after any write served by any app
   * server (see readCacheSync).
   */
  readCache: TtlCache<unknown>;
  /** Tells the other app servers about this one's writes; null when the cache is off. */
  readCacheSync: ReadCacheSync | null;
  /** Registers something to close (timers, stores) before the pool closes. */
  onClose: (closer: () => Promise<void> | void) => void;
  /** Closes everything the context opened, in order. */
  close: () => Promise<void>;
};

function databaseName(url: string): string {
  return decodeURIComponent(new URL(url).pathname.replace(/^\//, '')) || 'rindwise';
}

/** Builds the shared context; starts the local mail fake when no SMTP relay is configured. */
export async function createContext(
  config: AppConfig,
  overrides: Partial<Pick<AppContext, 'logger'>> = {},
): Promise<AppContext> {
  const logger = overrides.logger ?? createLogger(config.logLevel);
  const database = createDatabase(config.databaseUrl, config.databasePoolSize);
  let mailbox: LocalMailbox | null = null;
  let smtpUrl = config.smtpUrl;
  if (!smtpUrl) {
    if (config.isProduction) throw new Error('SMTP_URL is required in production.');
    mailbox = new LocalMailbox();
    const port = await mailbox.start();
    smtpUrl = `smtp://127.0.0.1:${port}`;
    logger.debug({ port }, 'local mail fake listening');
  }
  const mailer = new Mailer(smtpUrl, config.mailFrom, logger);
  const limiters = createLimiters(database.pool, databaseName(config.databaseUrl));
  const closers: Array<() => Promise<void> | void> = [];
  const storage = createStorage(config);
  const readCache = new TtlCache<unknown>(config.readCacheSeconds * 1000, 200);
  const readCacheSync = readCache.enabled
    ? startReadCacheSync(database.pool, readCache, logger, config.readCacheSyncMs)
    : null;
  if (readCacheSync) closers.push(readCacheSync.stop);
  return {
    config,
    logger,
    database,
    mailer,
    mailbox,
    limiters,
    storage,
    readCache,
    readCacheSync,
    onClose: (closer) => closers.push(closer),
    close: async () => {
      for (const closer of closers.reverse()) await closer();
      mailer.close();
      await mailbox?.stop();
      await database.close();
      if (storage instanceof S3Storage) storage.close();
    },
  };
}

/** The photo storage that the config names: the local folder by default, or S3. */
export function createStorage(config: AppConfig): PhotoStorage {
  return config.storage.kind === 's3'
    ? new S3Storage(config.storage)
    : new LocalStorage(path.join(config.uploadsDir, 'photos'));
}
