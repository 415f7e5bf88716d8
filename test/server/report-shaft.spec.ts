import { formatNumber } from '../../shared/engine';
import { calcTeam, revisionOf } from '../support/calc-harness';
import { appWithTestS3 } from '../support/s3-app';
import { readPdf } from '../support/pdf-harness';
import { wholeShaftInput } from '../support/shaft-fixture';

// The calc report of a whole-shaft calc, read back as text by Poppler: the new inputs, results,
// plots and the model's assumptions must all be there in words, not only in pictures.
const ctx = appWithTestS3({ ORG_NAME: 'Kestrel Fen Drives' });

type Agent = { agent: { get: (u: string) => import('supertest').Test } };
const getPdf = (session: Agent, id: number) =>
  session.agent
    .get(`/api/revisions/${id}/report.pdf`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });

const flat = (text: string) => text.replace(/\s+/g, ' ');
// The diagonal DRAFT mark's letters land between table cells in extracted text wherever they cross a row:
// match a row's cells in order, allowing one- or two-letter watermark pieces between them.
const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const cells = (...parts: string[]) => new RegExp(parts.map(escape).join(' (?:[A-Z·]{1,2} )*·?'));

describe('calc report of a whole-shaft calc', () => {
  it('when printed, then it lists the bearings, forces and masses as entered, with their units', async () => {
    const { author, revisionId } = await calcTeam(ctx.app, wholeShaftInput());
    const text = flat(readPdf((await getPdf(author.session, revisionId)).body as Buffer, 'whole-shaft-report').text);

    expect(text).toContain('Bearings (simple supports at their centres)');
    expect(text).toMatch(cells('B1 drive end', '20', 'deep-groove-ball', '25.5', '—', 'yes, takes the axial'));
    expect(text).toMatch(cells('B2 free end', '300', 'cylindrical-roller', '44'));
    expect(text).toContain('C kN');
    expect(text).toContain('Forces on the shaft');
    expect(text).toMatch(cells('G1', 'Gear', 'spur gear', '100', 'pitch ⌀ 180 mm, pressure angle 20°'));
    expect(text).toMatch(cells('C2', 'Coupling', 'flexible coupling', '390'));
    expect(text).toContain('Attached masses');
    expect(text).toMatch(cells('m1', 'gear', '100'));
    expect(text).toContain('Operating speed: 950 rpm');
  });

  it('when printed, then reactions, bearing life, deflection, critical speed and the assumptions are in the text, matching the stored result', async () => {
    const { author, revisionId } = await calcTeam(ctx.app, wholeShaftInput());
    const revision = await revisionOf(author.session, revisionId);
    const text = flat(readPdf((await getPdf(author.session, revisionId)).body as Buffer).text);
    const r = revision.result;

    expect(text).toMatch(/Largest deflection δ [\d.]+ mm/);
    expect(text).toContain('Shortest bearing life L10h');
    // Each key-result row fills every column: the outcome of the clause that judges it sits under "Against the
    // standard" (life and speed ratio; the largest deflection anywhere is not what the gear clause measures).
    expect(text).toMatch(cells('Largest deflection δ', formatNumber(r.deflection.max, 3), 'mm', '—', 'at 410 mm'));
    expect(text).toMatch(cells('Shortest bearing life L10h', '141000', 'h', 'meets min 20000 (§9.4)', 'bearing 1'));
    expect(text).toMatch(cells('Critical / operating speed', '45.8', 'meets min 2 (§9.5)', 'first critical'));
    expect(text).toContain('Bearings, deflection and critical speed');
    expect(text).toContain('Bearing reactions on the shaft and basic rating life');
    const fmt = (v: number) => formatNumber(v, 4);
    expect(text).toContain(fmt(r.supports[0].F));
    expect(text).toContain(`First bending critical speed ${fmt(r.criticalSpeed.rpm)} rpm`);
    expect(text).toContain('What this model assumes');
    // The report writes each assumption as a sentence (capital first letter); the words are the engine's.
    for (const a of r.assumptions as string[]) expect(text).toContain(flat(a).slice(1, 50));
    expect(text).toContain('Results support, never replace, the judgement of a qualified engineer');
    expect(text).not.toMatch(/NaN|Infinity|undefined/);
  });

  it('when printed, then the plots section has the loads key and the bending, deflection and slope diagrams', async () => {
    const { author, revisionId } = await calcTeam(ctx.app, wholeShaftInput());
    const text = flat(readPdf((await getPdf(author.session, revisionId)).body as Buffer).text);

    expect(text).toContain(
      'Blue arrows: forces applied to the shaft; black arrows: bearing reactions on the shaft. The side view shows Fy',
    );
    expect(text).toMatch(/G1 Gear, spur gear: Fy -?[\d.]+ N, Fz -?[\d.]+ N/);
    expect(text).toContain('Bending moment from the forces');
    expect(text).toContain('Deflection of the shaft');
    expect(text).toContain('Slope of the shaft');
  });

  it('when a calc has no bearings, then the report says so instead of printing empty tables', async () => {
    const { author, revisionId } = await calcTeam(ctx.app);
    const text = flat(readPdf((await getPdf(author.session, revisionId)).body as Buffer).text);
    expect(text).toContain('This calc has no bearings');
    expect(text).not.toContain('Bending moment from the forces');
  });
});
