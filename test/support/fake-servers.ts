import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startFakeSmtp } from '../../scripts/fakes/fake-smtp';
import { startFakeS3 } from '../../scripts/fakes/fake-s3';

/** The fake SMTP server of scripts/fake-services.ts, in-process on a free loopback port. */
export function startTestSmtp() {
  return startFakeSmtp({ port: 0 });
}

/** s3rver in-process on a free port with a throw-away folder, plus the config keys that point at it. */
export async function startTestS3(bucket = 'tt-test-attachments') {
  const directory = fs.mkdtempSync(path.join(os.tmpdir(), 'tt-s3-'));
  const s3 = await startFakeS3({ port: 0, directory, bucket });
  return {
    ...s3,
    config: { S3_ENDPOINT: s3.endpoint, S3_BUCKET: bucket },
    async close() {
      await s3.close();
      fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
