import type { AttachmentKind } from '../../shared/schemas/attachment.schema';
import { AppError } from '../errors/app-error';

// What a file's name promises, by its extension; checked against what its bytes are.
const BY_EXTENSION: Record<string, string> = {
  pdf: 'application/pdf',
  png: 'image/png',
  jpg: 'image/jpeg',
  jpeg: 'image/jpeg',
  tif: 'image/tiff',
  tiff: 'image/tiff',
  dwg: 'image/vnd.dwg',
  docx: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  txt: 'text/plain',
  csv: 'text/plain',
  dxf: 'text/plain',
};

const READABLE: Record<string, string> = {
  'application/pdf': 'PDF',
  'image/png': 'PNG image',
  'image/jpeg': 'JPEG image',
  'image/tiff': 'TIFF image',
  'image/vnd.dwg': 'DWG drawing',
  'application/vnd.openxmlformats-officedocument.wordprocessingml.document': 'Word document',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet': 'Excel workbook',
  'text/plain': 'plain text',
};

const DRAWING_TYPES = ['application/pdf', 'image/png', 'image/jpeg', 'image/tiff', 'image/vnd.dwg'];

/** Which contents each declared kind may have: a drawing is a drawing, a certificate a scanned or signed document. */
const KIND_RULES: Record<AttachmentKind, { accepts: (mediaType: string, ext: string) => boolean; says: string }> = {
  drawing: {
    accepts: (m, ext) => DRAWING_TYPES.includes(m) || (m === 'text/plain' && ext === 'dxf'),
    says: 'a drawing is a PDF, PNG, JPEG, TIFF, DWG or DXF file',
  },
  'material-certificate': {
    accepts: (m) => ['application/pdf', 'image/png', 'image/jpeg', 'image/tiff'].includes(m),
    says: 'a material certificate is a PDF or a scanned image (PNG, JPEG, TIFF)',
  },
  other: { accepts: () => true, says: '' },
};

/**
 * Refuses a file whose name or declared kind does not match its content (400 naming "file"):
 * a text file named .pdf is not a drawing, whatever the upload form said.
 */
export function assertDeclaredKind(fileName: string, kind: AttachmentKind, mediaType: string): void {
  const ext = /\.([A-Za-z0-9]+)$/.exec(fileName)?.[1]?.toLowerCase() ?? '';
  const promised = BY_EXTENSION[ext];
  const is = READABLE[mediaType] ?? mediaType;
  if (promised && promised !== mediaType) {
    throw AppError.validation({
      file: [`is named ".${ext}" but its content is ${is}; rename it or attach the real ${READABLE[promised]}`],
    });
  }
  const rule = KIND_RULES[kind];
  if (!rule.accepts(mediaType, ext))
    throw AppError.validation({ file: [`is ${is}, but ${rule.says}; choose the kind "Other" for supporting files`] });
}
