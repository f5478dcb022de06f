// Types for the TypeScript callers (tests, benchmarks) of database.mjs.
import type { PrivateMariaDb } from './mariadb.mjs';

export declare function startPrivateDatabase(options: {
  dir: string;
  database: string;
  remember: boolean;
}): Promise<{ db: PrivateMariaDb; url: string }>;

export declare function addDatabase(db: PrivateMariaDb, name: string): Promise<string>;

export declare const SCRATCH_DATABASE_NAMES: readonly [
  'rindwise_multi',
  'rindwise_explain',
  'rindwise_backup_src',
  'rindwise_backup_dst',
];
