// Types for the TypeScript callers (tests, benchmarks) of deps.mjs.
import type { MariadbBinaries } from './mariadb.mjs';

export declare function ensureNodeModules(root: string): Promise<void>;
export declare function findBinary(name: string): string | null;
export declare function ensureMariadbBinaries(): Promise<MariadbBinaries>;
export declare function ensureChromium(): Promise<string>;
