import {
  bendingPlot,
  deflectionPlot,
  hasBeamModel,
  shaftLimits,
  shaftLoads,
  shaftOutline,
  shearPlot,
  slopePlot,
  torquePlot,
  twistPlot,
  type LimitLine,
} from '../../shared/plots';
import type { CalcResult } from '../../shared/engine';
import type { Checklist, RuleSet } from '../../shared/rules';
import type { ReportData } from './report-data';
import { CONTENT_WIDTH, PAGE, ensureSpace, sectionHeading } from './report-doc';
import { drawChart } from './chart-draw';
import { drawOutline } from './outline-draw';
import { drawLoadsKey } from './loads-key';

/** Limits of clauses that measure `fact`, as lines over the segments they judge. */
function limitsOf(checklist: Checklist | null, ruleSet: RuleSet, fact: string, result: CalcResult): LimitLine[] {
  if (!checklist) return [];
  const clauses = new Map(ruleSet.clauses.filter((c) => c.measure?.actual === fact).map((c) => [c.id, c]));
  return checklist.rows
    .filter((r) => clauses.has(r.clauseId) && r.limit !== null && Number.isFinite(r.limit))
    .map((r, i) => {
      const seg = r.location.index === null ? undefined : result.segments[r.location.index];
      const sign = fact === 'twistTotal' && result.twistTotal < 0 ? -1 : 1;
      return { value: sign * r.limit!, from: seg?.start, to: seg?.end, label: i === 0 ? `§${r.clauseId} limit` : '' };
    });
}

/** Section: the outline to scale and the diagrams along it, from the same geometry as the editor. */
export function drawPlots(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  const r = d.result;
  if (!r) return;
  sectionHeading(doc, number, 'Shaft and diagrams');
  const input = d.input as {
    segments: { length: number; od: number; id: number; label?: string }[];
    features?: never[];
  };
  const outline = shaftOutline({ segments: input.segments, features: input.features ?? [] });
  const model = hasBeamModel(r);
  const loads = model ? shaftLoads(r, outline) : null;
  ensureSpace(doc, model ? 300 : 150);
  // Text drawn at fixed positions moves doc.y, so each figure sets it from where the figure began.
  const top = doc.y;
  doc.y =
    top +
    drawOutline(doc, outline, { x: PAGE.left, y: top, w: CONTENT_WIDTH, h: 300 }, r.fields['at']?.unit ?? '', loads) +
    8;
  if (loads) drawLoadsKey(doc, loads);
  const charts = [
    torquePlot(r),
    ...(model
      ? [
          bendingPlot(r),
          deflectionPlot(r, shaftLimits(d.checklist, d.ruleSet, r, 'deflection')),
          slopePlot(r, shaftLimits(d.checklist, d.ruleSet, r, 'slope')),
        ]
      : []),
    shearPlot(r, limitsOf(d.checklist, d.ruleSet, 'tauMax', r)),
    twistPlot(r, limitsOf(d.checklist, d.ruleSet, 'twistTotal', r)),
  ];
  for (const chart of charts) {
    ensureSpace(doc, 170);
    const y = doc.y;
    drawChart(doc, chart, { x: PAGE.left, y, w: CONTENT_WIDTH, h: 160 });
    doc.y = y + 172;
  }
  doc.x = PAGE.left;
}
