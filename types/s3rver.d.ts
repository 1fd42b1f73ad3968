// s3rver ships no types; this covers the part of its API that scripts/fakes.ts uses.
declare module "s3rver" {
  import type { AddressInfo } from "node:net";

  interface S3rverBucketConfig {
    name: string;
    /** CORS or website configuration documents (XML). */
    configs?: Array<string | Buffer>;
  }

  interface S3rverOptions {
    address?: string;
    port?: number;
    silent?: boolean;
    serviceEndpoint?: string;
    directory?: string;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: S3rverBucketConfig[];
  }

  class S3rver {
    constructor(options?: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
    reset(): void;
  }

  export default S3rver;
}
