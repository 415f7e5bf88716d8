import { loadConfig } from '../../server/config';
import { createReportDoc, PAGE, sectionHeading, subHeading } from '../../server/reports/report-doc';
import { drawTable } from '../../server/reports/pdf-table';

// Page breaks in the calc report, checked on the document model itself: which page each part lands on.
const fontDir = loadConfig().REPORT_FONT_DIR;
const pageOf = (doc: PDFKit.PDFDocument) => doc.bufferedPageRange().start + doc.bufferedPageRange().count - 1;
const TALL_ROW = [
  ['A requirement whose text runs over several lines of the narrow column it sits in, as clause texts often do', 'x'],
];
const COLUMNS = [
  { header: 'Requirement', share: 0.3 },
  { header: 'Value', share: 0.7 },
];

describe('report page breaks', () => {
  it.each([60, 45, 30])(
    'when a section heading falls %p pt above the foot of a page, then it moves to the next page with its table',
    (room) => {
      const doc = createReportDoc(fontDir, { title: 't', subject: 's', author: 'a' });
      doc.y = PAGE.bottom - room;
      sectionHeading(doc, 4, 'Checklist against the design standard');
      const headingPage = pageOf(doc);
      drawTable(doc, COLUMNS, TALL_ROW);
      expect(pageOf(doc)).toBe(headingPage);
      expect(headingPage).toBe(1);
    },
  );

  it('when a table header would fit but its first row would not, then both go to the next page together', () => {
    const doc = createReportDoc(fontDir, { title: 't', subject: 's', author: 'a' });
    subHeading(doc, "Checker's manual items");
    doc.y = PAGE.bottom - 30;
    const before = pageOf(doc);
    drawTable(doc, COLUMNS, TALL_ROW, { size: 8 });
    expect(pageOf(doc)).toBe(before + 1);
    expect(doc.y).toBeLessThan(PAGE.top + 80);
  });
});
