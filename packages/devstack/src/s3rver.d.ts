// s3rver 3.7 ships no types; this covers the part the devstack uses.
declare module 's3rver' {
  import type { IncomingMessage, ServerResponse } from 'node:http';

  interface S3rverOptions {
    address?: string;
    port?: number;
    silent?: boolean;
    directory?: string;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
  }

  export default class S3rver {
    constructor(options?: S3rverOptions);
    configureBuckets(): Promise<void>;
    /** The Koa request handler, for an http.Server of one's own. */
    callback(): (request: IncomingMessage, response: ServerResponse) => void;
  }
}
