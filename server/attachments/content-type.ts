import { fromBuffer } from 'file-type';
import { AppError } from '../errors/app-error';

/** What Torquetrail accepts, judged by the bytes (magic numbers), never by the file name. */
const ACCEPTED: Record<string, string> = {
  'application/pdf': 'PDF',
  'image/png': 'PNG',
  'image/jpeg': 'JPEG',
  'image/tiff': 'TIFF',
  'image/vnd.dwg': 'DWG drawing',
  'application/vnd.openxmlformats-officedocument.wordprocessingml.document': 'Word (.docx)',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet': 'Excel (.xlsx)',
  'text/plain': 'plain text (TXT, CSV, DXF)',
};

export const ACCEPTED_TYPE_NAMES = Object.values(ACCEPTED);

const NAMED_DANGERS: Record<string, string> = {
  'application/x-msdownload': 'a Windows program',
  'application/x-msi': 'a Windows installer',
  'application/x-elf': 'a Linux program',
  'application/x-mach-binary': 'a macOS program',
  'application/zip': 'a zip archive',
  'application/x-sh': 'a shell script',
};

function refuse(reason: string): AppError {
  return AppError.validation({ file: [`${reason}; accepted: ${ACCEPTED_TYPE_NAMES.join(', ')}`] });
}

// DWG has no entry in file-type 16; its files open with the version tag AC1012 … AC1032.
function isDwg(bytes: Buffer): boolean {
  return /^AC10\d\d$/.test(bytes.subarray(0, 6).toString('latin1'));
}

/** Text is accepted only when it is valid UTF-8 without control bytes, and is not a script. */
function isPlainText(bytes: Buffer): boolean {
  if (bytes.subarray(0, 2).toString('latin1') === '#!') return false;
  try {
    const text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    // eslint-disable-next-line no-control-regex -- control bytes are what makes a file not plain text
    return !/[\u0000-\u0008\u000B\u000E-\u001F\u007F]/.test(text);
  } catch {
    return false;
  }
}

/**
 * A PDF ends with `%%EOF` (ISO 32000-1, 7.5.5); readers look for it in the last 1,024 bytes, since a little may follow
 * it. Without it the file was cut short (an interrupted download or copy): kept as evidence, it would not open.
 */
function endsLikePdf(bytes: Buffer): boolean {
  return bytes.subarray(Math.max(0, bytes.length - 1024)).includes('%%EOF', 0, 'latin1');
}

/** The media type of an upload, from its content; throws a 400 naming the field and the reason. */
export async function detectMediaType(bytes: Buffer): Promise<string> {
  if (bytes.length === 0) throw AppError.validation({ file: ['is empty'] });
  if (isDwg(bytes)) return 'image/vnd.dwg';
  const found = await fromBuffer(bytes);
  if (found?.mime === 'application/pdf' && !endsLikePdf(bytes)) {
    throw AppError.validation({
      file: ['is a PDF that stops short of its end-of-file marker (%%EOF): upload the whole file again'],
    });
  }
  if (found && ACCEPTED[found.mime]) return found.mime;
  if (found) {
    const what = NAMED_DANGERS[found.mime] ?? `a .${found.ext} file`;
    throw refuse(`its content is ${what} (${found.mime}), whatever its name says`);
  }
  if (bytes.subarray(0, 2).toString('latin1') === '#!') throw refuse('its content is a script, whatever its name says');
  if (isPlainText(bytes)) return 'text/plain';
  throw refuse('its content is not a recognised drawing, certificate or document format');
}
