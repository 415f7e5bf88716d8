import {
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
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
 */
export class ObjectStore {
  private readonly client: S3Client;

  constructor(private readonly config: S3Settings) {
    this.client = new S3Client({
      endpoint: config.S3_ENDPOINT,
      region: config.S3_REGION,
      forcePathStyle: config.S3_FORCE_PATH_STYLE,
      credentials: { accessKeyId: config.S3_ACCESS_KEY_ID, secretAccessKey: config.S3_SECRET_ACCESS_KEY },
      // A storage outage should answer the user within seconds, not hang the request.
      maxAttempts: 2,
    });
  }

  static keyFor(sha256: string): string {
    return `sha256/${sha256.slice(0, 2)}/${sha256}`;
  }

  async putIfAbsent(key: string, body: Buffer, mediaType: string): Promise<void> {
    await this.guard('store the file', async () => {
      if (await this.exists(key)) return;
      await this.client.send(
        new PutObjectCommand({ Bucket: this.config.S3_BUCKET, Key: key, Body: body, ContentType: mediaType }),
      );
    });
  }

  async get(key: string): Promise<Buffer> {
    return this.guard('read the file', async () => {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.config.S3_BUCKET, Key: key }));
      return Buffer.from(await out.Body!.transformToByteArray());
    });
  }

  private async exists(key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.config.S3_BUCKET, Key: key }));
      return true;
    } catch (err) {
      if (err instanceof S3ServiceException && err.$metadata.httpStatusCode === 404) return false;
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
    this.client.destroy();
  }
}
