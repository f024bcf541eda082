import fs from 'node:fs';
import path from 'node:path';
import S3rver from 's3rver';

/**
 * The local S3-compatible fake used when no S3_ENDPOINT is configured: s3rver on loopback,
 * keeping its objects under DATA_DIR/s3, with the bucket created at start.
 */
export class LocalS3 {
  private server?: S3rver;
  readonly directory: string;

  constructor(dataDir: string, private readonly bucket: string) {
    this.directory = path.join(dataDir, 's3');
  }

  /** Starts the fake on `port` (0: any free port) and returns its endpoint URL. */
  async start(port: number): Promise<string> {
    fs.mkdirSync(this.directory, { recursive: true });
    this.server = new S3rver({
      address: '127.0.0.1',
      port,
      silent: true,
      directory: this.directory,
      // The app signs with the local defaults; the fake checks signatures like a real store.
      allowMismatchedSignatures: false,
      vhostBuckets: false,
      configureBuckets: [{ name: this.bucket }],
    });
    const address = await this.server.run();
    return `http://127.0.0.1:${address.port}`;
  }

  async stop(): Promise<void> {
    await this.server?.close().catch(() => undefined);
  }
}
