import QRCode from 'qrcode';
import { INK } from './report-doc';

/** The QR code as vector squares: sharp at any print scale and no image decoding in viewers. */
export function drawQr(doc: PDFKit.PDFDocument, text: string, x: number, y: number, size: number): void {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const n = qr.modules.size;
  // Four modules of quiet zone on every side, as scanners expect.
  const cell = size / (n + 8);
  doc.rect(x, y, size, size).fill('#ffffff');
  for (let row = 0; row < n; row++) {
    for (let col = 0; col < n; col++) {
      if (qr.modules.get(row, col)) doc.rect(x + (col + 4) * cell, y + (row + 4) * cell, cell, cell);
    }
  }
  doc.fill(INK);
}
