import type { S3Client } from '@aws-sdk/client-s3';
import type { Config } from '../config';
import { AppError } from '../errors/app-error';
import { logger } from '../logger';

type S3Settings = Pick<
  Config,
  'S3_ENDPOINT' | 'S3_REGION' | 'S3_BUCKET' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY' | 'S3_FORCE_PATH_STYLE'
>;

/**
 * Attachment bytes in object storage through the S3 API, so every app instance sees the same
 * files. Locally that is s3rver (scripts/fake-services.ts); a real bucket is a configuration
 * change. Keys are content hashes, so storing the same file twice writes it once.
 * The S3 client is loaded and made on first use, not with the server: most processes and test apps never touch
 * attachments, and loading the SDK cost every one of them at start (issue 14).
 */
export class ObjectStore {
  private client: S3Client | null = null;
  private sdk: Promise<typeof import('@aws-sdk/client-s3')> | null = null;

  constructor(private readonly config: S3Settings) {}

  /** The SDK and this store's client, both made once. */
  private async s3() {
    const sdk = await (this.sdk ??= import('@aws-sdk/client-s3'));
    this.client ??= new sdk.S3Client({
      endpoint: this.config.S3_ENDPOINT,
      region: this.config.S3_REGION,
      forcePathStyle: this.config.S3_FORCE_PATH_STYLE,
      credentials: { accessKeyId: this.config.S3_ACCESS_KEY_ID, secretAccessKey: this.config.S3_SECRET_ACCESS_KEY },
      // A storage outage should answer the user within seconds, not hang the request.
      maxAttempts: 2,
    });
    return { sdk, client: this.client };
  }

  static keyFor(sha256: string): string {
    return `sha256/${sha256.slice(0, 2)}/${sha256}`;
  }

  async putIfAbsent(key: string, body: Buffer, mediaType: string): Promise<void> {
    await this.guard('store the file', async () => {
      if (await this.exists(key)) return;
      const { sdk, client } = await this.s3();
      await client.send(
        new sdk.PutObjectCommand({ Bucket: this.config.S3_BUCKET, Key: key, Body: body, ContentType: mediaType }),
      );
    });
  }

  async get(key: string): Promise<Buffer> {
    return this.guard('read the file', async () => {
      const { sdk, client } = await this.s3();
      const out = await client.send(new sdk.GetObjectCommand({ Bucket: this.config.S3_BUCKET, Key: key }));
      return Buffer.from(await out.Body!.transformToByteArray());
    });
  }

  private async exists(key: string): Promise<boolean> {
    const { sdk, client } = await this.s3();
    try {
      await client.send(new sdk.HeadObjectCommand({ Bucket: this.config.S3_BUCKET, Key: key }));
      return true;
    } catch (err) {
      if (err instanceof sdk.S3ServiceException && err.$metadata.httpStatusCode === 404) return false;
      throw err;
    }
  }

  private async guard<T>(what: string, run: () => Promise<T>): Promise<T> {
    try {
      return await run();
    } catch (err) {
      logger.error({ err, bucket: this.config.S3_BUCKET }, `object storage: could not ${what}`);
      throw new AppError(
        'storage_unavailable',
        503,
        `Attachment storage is unavailable, so Torquetrail could not ${what}; nothing was lost — try again shortly`,
        undefined,
        true,
        { cause: err },
      );
    }
  }

  destroy(): void {
    this.client?.destroy();
    this.client = null;
  }
}
