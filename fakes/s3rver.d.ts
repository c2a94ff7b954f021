// Just the part of s3rver's API the fake uses (the package ships no types).
declare module "s3rver" {
  import type { IncomingMessage, ServerResponse } from "node:http";

  interface S3rverOptions {
    address?: string;
    port?: number;
    directory?: string;
    silent?: boolean;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    configureBuckets?: { name: string; configs: (string | Buffer)[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    /** Koa's request listener; s3rver's own server listens with it. */
    callback(): (req: IncomingMessage, res: ServerResponse) => void;
    close(): Promise<void>;
  }
}
