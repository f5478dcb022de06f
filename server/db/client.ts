import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as schema from './schema';

export type Database = MySql2Database<typeof schema>;

export type DatabaseHandle = {
  pool: mysql.Pool;
  db: Database;
  close: () => Promise<void>;
};

/** Opens a mysql2 pool on the given URL and wraps it in Drizzle. */
export function createDatabase(url: string, poolSize = 10): DatabaseHandle {
  const pool = mysql.createPool({
    uri: url,
    connectionLimit: poolSize,
    waitForConnections: true,
    queueLimit: 500,
    connectTimeout: 3000,
    enableKeepAlive: true,
    charset: 'utf8mb4_unicode_ci',
    timezone: 'Z',
    dateStrings: false,
    supportBigNumbers: true,
  });
  const db = drizzle(pool, { schema, mode: 'default' });
  return {
    pool,
    db,
    close: () => pool.end(),
  };
}

/** Resolves true when a real query reaches the database within the timeout. */
export async function pingDatabase(pool: mysql.Pool, timeoutMs = 2000): Promise<boolean> {
  try {
    await pool.query({ sql: 'SELECT 1', timeout: timeoutMs });
    return true;
  } catch {
    return false;
  }
}
