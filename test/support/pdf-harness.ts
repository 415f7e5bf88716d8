import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { execFileSync } from 'node:child_process';

export const REPORT_DIR = path.resolve(__dirname, '../../artifacts/reports');

/** Poppler's view of a PDF: its text (layout kept) and page count; fails if the file does not parse. */
export function readPdf(bytes: Buffer, keepAs?: string): { text: string; pages: number } {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tt-pdf-'));
  const file = path.join(dir, 'report.pdf');
  fs.writeFileSync(file, bytes);
  try {
    const text = execFileSync('pdftotext', ['-layout', '-enc', 'UTF-8', file, '-'], { encoding: 'utf8' });
    const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' });
    if (keepAs) {
      fs.mkdirSync(REPORT_DIR, { recursive: true });
      fs.copyFileSync(file, path.join(REPORT_DIR, `${keepAs}.pdf`));
      // Page one as a picture, to look at the report the way a person would.
      execFileSync('pdftoppm', [
        '-png',
        '-r',
        '80',
        '-f',
        '1',
        '-l',
        '1',
        '-singlefile',
        file,
        path.join(REPORT_DIR, `${keepAs}-page1`),
      ]);
    }
    return { text, pages: Number(/Pages:\s+(\d+)/.exec(info)?.[1] ?? 0) };
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

/** Fonts the PDF embeds, as pdffonts lists them. */
export function fontsOf(bytes: Buffer): string {
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'tt-pdf-')), 'r.pdf');
  fs.writeFileSync(file, bytes);
  try {
    return execFileSync('pdffonts', [file], { encoding: 'utf8' });
  } finally {
    fs.rmSync(path.dirname(file), { recursive: true, force: true });
  }
}
