import { startTestApp, person } from '../support/api-harness';
import { advanceTo, createCalc, revisionOf, sign, tickAll, type Team } from '../support/calc-harness';
import { auditOf, lastAuditId } from '../support/audit-harness';

const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

// The ids the workflow standard (a copy of KFD-ENG-014 v3) lists under manualItems.
const ITEM_IDS = ['material-certificate', 'load-cases', 'drawing-reference'];

async function team(state: 'draft' | 'in_check' | 'checked' = 'in_check') {
  const author = await person(app, ['author']);
  const checker = await person(app, ['checker']);
  const approver = await person(app, ['approver']);
  const { revisionId } = await createCalc(author.session);
  const sessions: Team = { author: author.session, checker: checker.session, approver: approver.session };
  if (state !== 'draft') await advanceTo(state, sessions, revisionId);
  return { author, checker, approver, revisionId, sessions };
}

const tick = (
  s: Team['checker'],
  id: number,
  item: string,
  body: object = { done: true, note: 'Seen cert 3.1 no. 4471' },
) => s.put(`/api/revisions/${id}/manual-items/${item}`, body);

describe('ticking manual items', () => {
  it('when the independent checker ticks an item during check, then it is recorded with their name and audited', async () => {
    // Arrange
    const t = await team();
    const since = await lastAuditId();

    // Act
    const res = await tick(t.checker.session, t.revisionId, 'material-certificate');

    // Assert
    expect(res.status).toBe(200);
    expect(res.body.manualItems['material-certificate']).toEqual({
      done: true,
      note: 'Seen cert 3.1 no. 4471',
      by: t.checker.displayName,
      at: expect.any(String),
    });
    expect(await auditOf('Revision', t.revisionId, since)).toEqual([
      expect.objectContaining({
        action: 'revision.manual_item',
        actorId: t.checker.user.id,
        payload: { itemId: 'material-certificate', done: true, note: 'Seen cert 3.1 no. 4471' },
      }),
    ]);
  });

  it.each([
    ['the author', 'in check', 'author'],
    ['an approver', 'in check', 'approver'],
    ['the checker', 'draft', 'checker'],
    ['the checker', 'checked', 'checker'],
  ] as const)(
    'when %s ticks an item while the revision is %s, then it is refused with 403 and nothing is ticked',
    async (_who, state, role) => {
      // Arrange
      const t = await team(state === 'in check' ? 'in_check' : state);
      const before = (await revisionOf(t.sessions.author, t.revisionId)).manualItems;

      // Act
      const res = await tick(t.sessions[role], t.revisionId, 'load-cases');

      // Assert
      expect(res.status).toBe(403);
      expect(res.body.message).toMatch(
        /Manual checklist items are ticked by the independent checker while the calc is in check/,
      );
      expect((await revisionOf(t.sessions.author, t.revisionId)).manualItems).toEqual(before);
    },
  );

  it('when a compliance user ticks an item, then it is refused with 403', async () => {
    // Arrange
    const t = await team();
    const compliance = await person(app, ['compliance']);

    // Act
    const res = await tick(compliance.session, t.revisionId, 'load-cases');

    // Assert
    expect(res.status).toBe(403);
  });

  it('when the item id is not one the standard lists, then it is refused with 400 naming the item and nothing is stored', async () => {
    // Arrange
    const t = await team();
    const since = await lastAuditId();

    // Act
    const res = await tick(t.checker.session, t.revisionId, 'anything-goes');

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/"anything-goes" is not a manual item of TST-/);
    expect(res.body.fieldErrors['params.itemId']).toEqual([expect.stringMatching(/is not a manual item/)]);
    expect((await revisionOf(t.sessions.author, t.revisionId)).manualItems).toEqual({});
    expect(await auditOf('Revision', t.revisionId, since)).toEqual([]);
  });

  it.each([
    ['an item id with spaces', 'not an id', {}, 'params.itemId'],
    ['done is not a boolean', 'load-cases', { done: 'yes' }, 'done'],
    ['an unknown field', 'load-cases', { done: true, by: 'Someone Else' }, 'by'],
  ])('when %s is sent, then it is refused with 400 naming the field', async (_what, item, body, field) => {
    // Arrange
    const t = await team();

    // Act
    const res = await t.checker.session.put(
      `/api/revisions/${t.revisionId}/manual-items/${encodeURIComponent(item)}`,
      body,
    );

    // Assert
    expect(res.status).toBe(400);
    expect(res.body.fieldErrors[field]).toBeDefined();
  });
});

describe('checking needs every manual item ticked', () => {
  it('when one item is still open, then signing as checked is refused, and accepted once it is ticked', async () => {
    // Arrange
    const t = await team();
    for (const id of ITEM_IDS.slice(0, 2)) await tick(t.checker.session, t.revisionId, id);

    // Act
    const refused = await sign(t.checker.session, t.revisionId, 'checked');
    await tick(t.checker.session, t.revisionId, ITEM_IDS[2]);
    const accepted = await sign(t.checker.session, t.revisionId, 'checked');

    // Assert
    expect(refused.status).toBe(403);
    expect(refused.body.message).toMatch(/Tick the 1 open manual checklist item\(s\) first/);
    expect(accepted.status).toBe(200);
    expect(accepted.body.status).toBe('checked');
  });

  it('when the checker unticks an item, then it counts as open again', async () => {
    // Arrange
    const t = await team();
    await tickAll(t.checker.session, t.revisionId);

    // Act
    await tick(t.checker.session, t.revisionId, 'load-cases', { done: false, note: 'Duty spec changed' });
    const res = await sign(t.checker.session, t.revisionId, 'checked');

    // Assert
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/Tick the 1 open manual checklist item\(s\) first/);
  });
});
