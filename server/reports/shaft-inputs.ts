import { UNIT_LABELS, type CalcInput } from '../../shared/engine';
import { BEAM_LABELS, STEEL_DENSITY } from '../../shared/engine/beam/beam-units';
import { bearingTag, loadName, loadTag } from '../../shared/plots';
import { paragraph, subHeading } from './report-doc';
import { drawTable } from './pdf-table';
import { num } from './front-matter';

type Load = NonNullable<CalcInput['loads']>[number];

function loadDetails(l: Load, u: { length: string; torque: string; force: string }): string {
  const own =
    'T' in l && l.T !== undefined ? `; own T ${num(l.T)} ${u.torque}` : '; T from the torque entry at this station';
  if (!('kind' in l) || l.kind === undefined) {
    return (
      [
        ['Fy', l.Fy],
        ['Fz', l.Fz],
        ['Fx', l.Fx],
      ]
        .filter(([, v]) => v !== undefined)
        .map(([k, v]) => `${k} ${num(v as number)} ${u.force}`)
        .join(', ') || 'no force entered'
    );
  }
  switch (l.kind) {
    case 'gear':
      return `pitch ⌀ ${num(l.pitchDiameter)} ${u.length}, pressure angle ${num(l.pressureAngle ?? 20)}°, helix ${num(l.helixAngle ?? 0)}°, mesh at ${num(l.direction ?? 0)}°${own}`;
    case 'pulley':
    case 'sprocket':
      return `pitch ⌀ ${num(l.diameter)} ${u.length}, pull factor ${l.pullFactor === undefined ? 'default' : num(l.pullFactor)}, pull at ${num(l.direction ?? 0)}°${own}`;
    case 'coupling':
      return `${
        [
          ['Fy', l.Fy],
          ['Fz', l.Fz],
        ]
          .filter(([, v]) => v !== undefined)
          .map(([k, v]) => `${k} ${num(v as number)} ${u.force}`)
          .join(', ') || 'no radial force'
      }${own}`;
  }
}

/**
 * Part of the inputs section: bearings, force elements, attached masses, density and speed, exactly as
 * entered. Nothing is printed for a calc without them (a format v1 calc).
 */
export function drawShaftInputs(doc: PDFKit.PDFDocument, input: CalcInput): void {
  const units = input.units === 'US' ? 'US' : 'SI';
  const u = { ...UNIT_LABELS[units], ...BEAM_LABELS[units] };
  if (input.supports?.length) {
    subHeading(doc, 'Bearings (simple supports at their centres)');
    drawTable(
      doc,
      [
        { header: 'Tag', share: 0.07 },
        { header: 'Label', share: 0.2 },
        { header: `At ${u.length}`, share: 0.1, align: 'right', mono: true },
        { header: 'Kind', share: 0.2 },
        { header: `C ${u.rating}`, share: 0.12, align: 'right', mono: true },
        { header: 'X / Y', share: 0.13, mono: true },
        { header: 'Locating', share: 0.18 },
      ],
      input.supports.map((s, i) => [
        bearingTag(i),
        s.label ?? '',
        num(s.at),
        s.kind,
        s.C === undefined ? '—' : num(s.C),
        s.X === undefined && s.Y === undefined ? '—' : `${num(s.X ?? null)} / ${num(s.Y ?? null)}`,
        s.locating ? 'yes, takes the axial load' : 'no',
      ]),
    );
  }
  if (input.loads?.length) {
    subHeading(doc, 'Forces on the shaft');
    drawTable(
      doc,
      [
        { header: 'Tag', share: 0.07 },
        { header: 'Element', share: 0.14 },
        { header: 'Label', share: 0.17 },
        { header: `At ${u.length}`, share: 0.1, align: 'right', mono: true },
        { header: 'As entered', share: 0.52 },
      ],
      input.loads.map((l, i) => {
        const kind = 'kind' in l ? l.kind : undefined;
        return [loadTag(kind, i), loadName(kind), l.label ?? '', num(l.at), loadDetails(l, u)];
      }),
    );
  }
  if (input.masses?.length) {
    subHeading(doc, 'Attached masses');
    drawTable(
      doc,
      [
        { header: 'Tag', share: 0.07 },
        { header: 'Label', share: 0.45 },
        { header: `At ${u.length}`, share: 0.2, align: 'right', mono: true },
        { header: `Mass ${u.mass}`, share: 0.28, align: 'right', mono: true },
      ],
      input.masses.map((m, i) => [`m${i + 1}`, m.label ?? '', num(m.at), num(m.mass)]),
    );
  }
  if (input.supports?.length || input.speed !== undefined || input.material.density !== undefined) {
    paragraph(
      doc,
      `Operating speed: ${input.speed === undefined ? "not entered (a power entry's speed is used where there is one)" : `${num(input.speed)} rpm`}. ` +
        `Shaft density: ${input.material.density === undefined ? `not entered (steel, ${STEEL_DENSITY[units]} ${u.density})` : `${num(input.material.density)} ${u.density}`}.`,
    );
  }
}
