// s3rver ships no type declarations; this covers the part we use.
declare module "s3rver" {
  type BucketConfig = { name: string; configs?: (string | Buffer)[] };
  type Options = {
    port?: number;
    address?: string;
    directory?: string;
    silent?: boolean;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: BucketConfig[];
  };
  export default class S3rver {
    constructor(options?: Options);
    run(): Promise<{ address: string; port: number; family: string }>;
    close(): Promise<void>;
  }
}
