import type { ShaftLoads } from '../../shared/plots';
import { INK_SOFT, paragraph } from './report-doc';

/** The words under the outline: what each arrow is and its components, so no value is only in the picture. */
export function drawLoadsKey(doc: PDFKit.PDFDocument, loads: ShaftLoads): void {
  paragraph(
    doc,
    'Blue arrows: forces applied to the shaft; black arrows: bearing reactions on the shaft. The side view shows Fy (y up), ' +
      'the strip below it Fz (z up). Arrow length is proportional to the force; stations are to scale.',
    { color: INK_SOFT, size: 7.5 },
  );
  paragraph(doc, loads.arrows.map((a) => a.name).join(' · '), { size: 7.5 });
  doc.y += 4;
}
