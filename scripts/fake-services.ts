/*
 * The stand-ins that run beside Torquetrail in development and tests: a fake SMTP server (the
 * real protocol; messages kept as JSON lines) and s3rver (the S3 API over a local folder). Run by
 * scripts/start.sh and scripts/test.sh with `tsx scripts/fake-services.ts`; reads the same
 * variables as the app (SMTP_PORT, S3_ENDPOINT, S3_BUCKET) plus FAKE_DATA_DIR for their files.
 * A service whose variables point away from loopback is a real one, and is not faked.
 */
import path from 'node:path';
import { startFakeSmtp } from './fakes/fake-smtp';
import { startFakeS3 } from './fakes/fake-s3';

const LOOPBACK = new Set(['127.0.0.1', 'localhost', '::1']);

async function main(): Promise<void> {
  const dataDir = path.resolve(process.env.FAKE_DATA_DIR ?? '.data/fakes');
  const closers: (() => Promise<void>)[] = [];
  const smtpHost = process.env.SMTP_HOST ?? '127.0.0.1';
  if (LOOPBACK.has(smtpHost)) {
    const smtp = await startFakeSmtp({
      port: Number(process.env.SMTP_PORT ?? 2525),
      host: '127.0.0.1',
      inboxFile: path.join(dataDir, 'mail', 'inbox.jsonl'),
    });
    closers.push(smtp.close);
    console.log(
      `fake SMTP on 127.0.0.1:${smtp.port}; received mail is appended to ${path.join(dataDir, 'mail', 'inbox.jsonl')}`,
    );
  }
  const endpoint = new URL(process.env.S3_ENDPOINT ?? 'http://127.0.0.1:4569');
  if (LOOPBACK.has(endpoint.hostname)) {
    const s3 = await startFakeS3({
      port: Number(endpoint.port || 80),
      directory: path.join(dataDir, 's3'),
      bucket: process.env.S3_BUCKET ?? 'torquetrail-attachments',
    });
    closers.push(s3.close);
    console.log(`fake S3 (s3rver) at ${s3.endpoint}, files in ${path.join(dataDir, 's3')}`);
  }
  const stop = () => void Promise.allSettled(closers.map((c) => c())).finally(() => process.exit(0));
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
  console.log('fake services ready');
}

main().catch((err) => {
  console.error(`fake services could not start: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
