import PDFDocument from 'pdfkit';

const FONT = '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf';

/**
 * A one-page PDF standing in for a scanned document in the demo (a drawing or a mill
 * certificate). It says plainly that it is invented, so nobody mistakes it for a real record.
 */
export function demoDocument(title: string, lines: string[]): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({
      size: 'A4',
      margin: 56,
      info: { Title: title, Author: 'Kestrel Fen Drives (invented demo)' },
    });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.font(FONT).fontSize(18).text(title);
    doc.moveDown().fontSize(11);
    for (const line of lines) doc.text(line);
    doc.moveDown().fontSize(9).fillColor('#9a4d10').text('Invented for the Torquetrail demo. Not a real document.');
    doc.end();
  });
}

export const DEMO_CERTIFICATE = (grade: string, heat: string) =>
  demoDocument(`Mill certificate — ${grade}`, [
    'Supplier: Fenland Bar & Section (invented)',
    `Grade: ${grade}`,
    `Heat number: ${heat}`,
    'Condition: as stated on the order',
    'Tensile and yield results: at or above the specified minimum',
  ]);

export const DEMO_DRAWING = (number: string, title: string) =>
  demoDocument(`Drawing ${number}`, [
    `Title: ${title}`,
    'Sheet 1 of 1, revision as released',
    'Dimensions in millimetres; general tolerances per house standard',
  ]);
