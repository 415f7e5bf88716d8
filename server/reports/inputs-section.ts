import { UNIT_LABELS, type CalcInput, type FeatureInput, type UnitSystem } from '../../shared/engine';
import { featureTag } from '../../shared/plots';
import type { ReportData } from './report-data';
import { paragraph, sectionHeading, subHeading } from './report-doc';
import { drawTable } from './pdf-table';
import { num } from './front-matter';
import { drawShaftInputs } from './shaft-inputs';

function featureDetails(f: FeatureInput, len: string): string {
  const entered = [f.Kt ? `Kt ${f.Kt}` : '', f.Kts ? `Kts ${f.Kts}` : ''].filter(Boolean).join(', ');
  const own = entered ? `; entered ${entered}${f.source ? ` (${f.source})` : ''}` : '';
  switch (f.type) {
    case 'shoulder-fillet':
      return `r ${num(f.r)} ${len}${own}`;
    case 'keyseat':
      return `${f.form}; r ${f.r ? `${num(f.r)} ${len}` : 'default'}; key ${[f.width, f.height, f.length].map((v) => (v ? num(v) : '?')).join(' × ')} ${len}${own}`;
    case 'ring-groove':
      return `depth ${num(f.depth)}, r ${num(f.r)}${f.width ? `, width ${num(f.width)}` : ''} ${len}${own}`;
    case 'cross-hole':
      return `hole ⌀ ${num(f.diameter)} ${len}${own}`;
  }
}

function materialLine(m: CalcInput['material'], units: UnitSystem): string {
  const u = UNIT_LABELS[units];
  return (
    `${m.name ?? 'unnamed'} (${m.kind ?? 'steel'}): E ${num(m.E)} ${u.modulus}, G ${num(m.G)} ${u.modulus}, Sy ${num(m.Sy)} ${u.stress}, Su ${num(m.Su)} ${u.stress}` +
    `${m.nu ? `, ν ${m.nu}` : ''}. Source: ${m.source ?? 'not given'}.`
  );
}

function loadRows(input: CalcInput, u: Record<string, string>): string[][] {
  const torques = input.torques.map((t, i) => [
    'T',
    String(i + 1),
    t.label ?? '',
    num(t.at),
    'T' in t ? `${num(t.T)} ${u.torque}` : `${num(t.power)} ${u.power} at ${num(t.speed)} rpm (T from P = T·ω)`,
    t.Ta ? `${num(t.Ta)} ${u.torque}` : '—',
  ]);
  const bending = (input.bending ?? []).map((b, i) => [
    'M',
    String(i + 1),
    b.label ?? '',
    num(b.at),
    `Mm ${num(b.Mm ?? 0)} ${u.torque}`,
    `${num(b.Ma)} ${u.torque}`,
  ]);
  return [...torques, ...bending];
}

/** Section: exactly what the author entered, in the calc's own units. */
export function drawInputs(doc: PDFKit.PDFDocument, d: ReportData, number: number): void {
  sectionHeading(doc, number, 'Inputs');
  const input = d.input as unknown as CalcInput;
  if (!Array.isArray(input.segments)) return paragraph(doc, 'The stored input is incomplete; see the input issues.');
  const u = UNIT_LABELS[input.units] ?? UNIT_LABELS.SI;
  paragraph(doc, `Unit system ${input.units}. Material: ${materialLine(input.material, input.units)}`);
  subHeading(doc, 'Segments, left to right');
  drawTable(
    doc,
    [
      { header: '#', share: 0.05 },
      { header: 'Label', share: 0.3 },
      { header: `Length ${u.length}`, share: 0.13, align: 'right', mono: true },
      { header: `OD ${u.length}`, share: 0.12, align: 'right', mono: true },
      { header: `ID ${u.length}`, share: 0.12, align: 'right', mono: true },
      { header: 'Material', share: 0.28 },
    ],
    input.segments.map((s, i) => [
      String(i + 1),
      s.label ?? '',
      num(s.length),
      num(s.od),
      num(s.id),
      s.material?.name ?? 'as calc',
    ]),
  );
  if (input.features?.length) {
    subHeading(doc, 'Features');
    drawTable(
      doc,
      [
        { header: 'Tag', share: 0.07 },
        { header: 'Type', share: 0.16 },
        { header: 'Label', share: 0.2 },
        { header: `At ${u.length}`, share: 0.1, align: 'right', mono: true },
        { header: 'Dimensions and entered factors', share: 0.47 },
      ],
      input.features.map((f, i) => [
        featureTag(f.type, i),
        f.type,
        f.label ?? '',
        num(f.at),
        featureDetails(f, u.length),
      ]),
    );
  }
  subHeading(doc, 'Load cases: torques (T) and bending moments (M)');
  drawTable(
    doc,
    [
      { header: 'Kind', share: 0.07 },
      { header: '#', share: 0.05 },
      { header: 'Label', share: 0.25 },
      { header: `At ${u.length}`, share: 0.1, align: 'right', mono: true },
      { header: 'Steady / midrange', share: 0.35 },
      { header: 'Alternating', share: 0.18 },
    ],
    loadRows(input, u),
  );
  drawShaftInputs(doc, input);
  const fat = input.fatigue;
  if (fat)
    paragraph(
      doc,
      `Fatigue: surface ${fat.surface}${fat.reliability ? `, reliability ${fat.reliability} %` : ''}${fat.temperature !== undefined ? `, temperature ${fat.temperature} ${u.temperature}` : ''}${fat.alternatingTorqueFraction !== undefined ? `, Ta = ${fat.alternatingTorqueFraction} × |Tm|` : ''}${fat.SePrime ? `, Se′ entered ${fat.SePrime} ${u.stress} (${fat.SePrimeSource ?? 'no source'})` : ''}.`,
    );
  if (input.notes) paragraph(doc, `Notes: ${input.notes}`);
}
