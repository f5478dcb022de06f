// s3rver ships no types; this is the part of its API the tests use.
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';

  type S3rverOptions = {
    address?: string;
    port?: number;
    silent?: boolean;
    directory?: string;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
  };

  export default class S3rver {
    constructor(options?: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
