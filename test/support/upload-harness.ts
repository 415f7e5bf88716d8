import type { Session } from './api-harness';

/** A tiny but genuine PDF header: enough for content detection, which reads the first bytes. */
export function pdfBytes(size = 200, text = 'test document'): Buffer {
  const head = Buffer.from(`%PDF-1.4\n% ${text}\n1 0 obj << /Type /Catalog >> endobj\n`);
  const tail = Buffer.from('\ntrailer << /Root 1 0 R >>\n%%EOF\n');
  return Buffer.concat([head, Buffer.alloc(Math.max(0, size - head.length - tail.length), 0x20), tail]);
}

/** A Windows program: "MZ", a DOS stub and a PE signature, whatever name it travels under. */
export function windowsProgram(): Buffer {
  const bytes = Buffer.alloc(512, 0);
  bytes.write('MZ', 0, 'latin1');
  bytes.writeUInt32LE(0x80, 0x3c);
  bytes.write('PE\0\0', 0x80, 'latin1');
  return bytes;
}

/** Uploads like the browser does: multipart with the CSRF header. */
export function upload(
  s: Session,
  revisionId: number,
  file: Buffer | null,
  fields: Record<string, string>,
  filename = 'file.pdf',
) {
  let req = s.agent.post(`/api/revisions/${revisionId}/attachments`).set('x-csrf-token', s.csrf);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return file ? req.attach('file', file, { filename, contentType: 'application/octet-stream' }) : req;
}
