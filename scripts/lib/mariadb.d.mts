// Types for the TypeScript callers (tests, benchmarks) of mariadb.mjs.
export type MariadbBinaries = {
  server: string;
  installDb: string;
  client: string;
  admin: string;
  dump: string | null;
};

export declare class PrivateMariaDb {
  constructor(options: { dir: string; port: number; binaries: MariadbBinaries });
  readonly dir: string;
  readonly dataDir: string;
  readonly port: number;
  readonly socket: string;
  readonly errorLog: string;
  readonly tmpDir: string;
  readonly pidFile: string;
  readonly bin: MariadbBinaries;
  child: import('node:child_process').ChildProcess | null;
  readonly initialised: boolean;
  init(): Promise<void>;
  runningPid(): number | null;
  start(): Promise<void>;
  sql(statement: string): Promise<string>;
  ensureDatabase(options: { database: string; user: string; password: string }): Promise<void>;
  stop(): Promise<void>;
}
