// Types for the TypeScript callers (tests, benchmarks) of database.mjs.
import type { PrivateMariaDb } from './mariadb.mjs';

export declare function startPrivateDatabase(options: {
  dir: string;
  database: string;
  remember: boolean;
}): Promise<{ db: PrivateMariaDb; url: string }>;

export declare function addDatabase(db: PrivateMariaDb, name: string): Promise<string>;
