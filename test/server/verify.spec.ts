import { startTestApp, signedInAs, anonymousAgent } from '../support/api-harness';
import { calcTeam, fixtureInput, revisionOf, sign, tickAll } from '../support/calc-harness';
import { Revision } from '../../server/db/models';

// Record verification: the hash printed on a report (and in its QR code) looked up by anyone signed in.
const { app, sequelize } = startTestApp();
afterAll(() => sequelize.close());

async function approved() {
  const team = await calcTeam(app);
  await sign(team.author.session, team.revisionId, 'authored');
  await tickAll(team.checker.session, team.revisionId);
  await sign(team.checker.session, team.revisionId, 'checked');
  await sign(team.approver.session, team.revisionId, 'approved');
  return { ...team, hash: (await revisionOf(team.author.session, team.revisionId)).contentHash as string };
}

describe('verify a record hash', () => {
  it('when the hash of an approved revision is given, then it matches, with its state and three valid signatures', async () => {
    const { calc, hash } = await approved();
    const { session } = await signedInAs(app, ['admin']);

    const res = await session.get(`/api/verify/${hash.toUpperCase()}`);

    expect(res.status).toBe(200);
    expect(res.body).toEqual(
      expect.objectContaining({ hash, found: true, caution: expect.stringMatching(/qualified engineer/) }),
    );
    expect(res.body.matches).toEqual([
      expect.objectContaining({
        calcNumber: calc.number,
        revision: 'A',
        state: 'approved',
        verdict: 'compliant',
        match: 'current',
        contentIntact: true,
      }),
    ]);
    expect(
      res.body.matches[0].signatures.map((s: { meaning: string; isValid: boolean; coversThisHash: boolean }) => [
        s.meaning,
        s.isValid,
        s.coversThisHash,
      ]),
    ).toEqual([
      ['authored', true, true],
      ['checked', true, true],
      ['approved', true, true],
    ]);
    expect(res.body.message).toMatch(
      /matches .* rev A \(approved\) as stored now; valid signatures: authored, checked, approved/,
    );
  });

  it('when a hash was signed and the content changed since, then it is reported as an earlier state of that revision', async () => {
    const { author, checker, revisionId } = await calcTeam(app);
    await sign(author.session, revisionId, 'authored');
    const signedHash = (await revisionOf(author.session, revisionId)).contentHash;
    const r = await revisionOf(checker.session, revisionId);
    await checker.session.post(`/api/revisions/${revisionId}/return`, {
      reason: 'Check the coupling seat diameter',
      lockVersion: r.lockVersion,
    });
    const input = fixtureInput() as { segments: { od: number }[] };
    input.segments[4].od = 40;
    const saved = await author.session.put(`/api/revisions/${revisionId}`, {
      input,
      lockVersion: (await revisionOf(author.session, revisionId)).lockVersion,
    });
    expect(saved.body.contentHash).not.toBe(signedHash);

    const res = await checker.session.get(`/api/verify/${signedHash}`);

    expect(res.body.matches).toEqual([expect.objectContaining({ match: 'earlier', state: 'returned' })]);
    expect(res.body.matches[0].signatures).toEqual([
      expect.objectContaining({ meaning: 'authored', isValid: false, coversThisHash: true }),
    ]);
    expect(res.body.message).toMatch(/content has changed since/);
  });

  it('when the stored content is altered behind the application, then the hash still finds the revision but says it is not intact', async () => {
    const { revisionId, hash, author } = await approved();
    const row = (await Revision.findByPk(revisionId))!;
    await sequelize.query('UPDATE revisions SET input = ? WHERE id = ?', {
      replacements: [row.input.replace('"od":35', '"od":36'), revisionId],
    });

    const res = await author.session.get(`/api/verify/${hash}`);

    expect(res.body.matches[0]).toEqual(expect.objectContaining({ match: 'current', contentIntact: false }));
    expect(res.body.matches[0].signatures.every((s: { isValid: boolean }) => !s.isValid)).toBe(true);
    expect(res.body.message).toMatch(/no longer hashes to it/);
  });

  it('when the hash is unknown, then nothing is found and the message says what that means', async () => {
    const { session } = await signedInAs(app, ['checker']);
    const res = await session.get(`/api/verify/${'ab'.repeat(32)}`);
    expect(res.body).toEqual(expect.objectContaining({ found: false, matches: [] }));
    expect(res.body.message).toMatch(/No revision on record has this hash/);
  });

  it('when the hash is malformed or nobody is signed in, then 400 naming the field, and 401', async () => {
    const { session } = await signedInAs(app, ['author']);
    const { agent } = await anonymousAgent(app);

    const bad = await session.get('/api/verify/not-a-hash');

    expect(bad.status).toBe(400);
    expect(bad.body.fieldErrors['params.hash']).toEqual([
      'must be the 64 hexadecimal characters of the record hash printed on the report',
    ]);
    expect((await agent.get(`/api/verify/${'ab'.repeat(32)}`)).status).toBe(401);
  });
});
