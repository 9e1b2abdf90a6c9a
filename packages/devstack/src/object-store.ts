import { mkdirSync } from 'node:fs';
import { createServer } from 'node:http';
import S3rver from 's3rver';

export interface ObjectStore {
  port: number;
  endpoint: string;
  bucket: string;
  close(): Promise<void>;
}

export interface ObjectStoreOptions {
  port: number;
  dataDir: string;
  bucket: string;
  host?: string;
}

/**
 * s3rver: an S3-compatible HTTP server on 127.0.0.1 keeping objects as files in dataDir, with the bucket made
 * at start (an existing bucket and its objects are kept). It checks request signatures, so clients use the
 * stack's S3_ACCESS_KEY_ID / S3_SECRET_ACCESS_KEY (s3rver's fixed S3RVER pair) and path-style addressing.
 */
export async function startObjectStore(options: ObjectStoreOptions): Promise<ObjectStore> {
  mkdirSync(options.dataDir, { recursive: true });
  const host = options.host ?? '127.0.0.1';
  const s3rver = new S3rver({
    directory: options.dataDir,
    silent: true,
    // Path-style only: virtual-host names (bucket.127.0.0.1) would not resolve without DNS tricks.
    vhostBuckets: false,
    configureBuckets: [{ name: options.bucket }],
  });
  await s3rver.configureBuckets();
  // Our own http.Server rather than s3rver.run(): run() never settles when the port is taken, and the
  // listen error then surfaces as an uncaught exception.
  const server = createServer(s3rver.callback());
  await new Promise<void>((resolve, reject) => {
    server.once('error', (error: NodeJS.ErrnoException) => {
      reject(
        error.code === 'EADDRINUSE' ? new Error(`Port ${options.port} (S3 object store) is already in use.`) : error,
      );
    });
    server.listen(options.port, host, () => resolve());
  });
  server.on('error', (error) => process.stderr.write(`[s3] ${error.message}\n`));
  const address = server.address();
  const port = typeof address === 'object' && address !== null ? address.port : options.port;
  let closing: Promise<void> | null = null;
  return {
    port,
    endpoint: `http://${host}:${port}`,
    bucket: options.bucket,
    // Idempotent, because the orchestrator's shutdown and a drill may both stop it. Node 20's close() also
    // drops idle keep-alive sockets; closeAllConnections() ends any request still open, so stopping never hangs.
    close: () =>
      (closing ??= new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      })),
  };
}
