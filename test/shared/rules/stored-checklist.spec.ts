import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { isDeepStrictEqual } from 'node:util';
import { compactChecklist, expandChecklist } from '../../../server/calcs/stored-checklist';
import { computeRecord } from '../../../server/calcs/revision-content';
import { conveyorHeadShaft, hoistDrumShaft } from '../../../server/db/demo/demo-handling-shafts';
import { mixerShaft, slurryPumpShaft } from '../../../server/db/demo/demo-process-shafts';
import type { Checklist } from '../../../shared/rules';
import { loadRuleSet } from './rules-helpers';

const ROOT = join(__dirname, '..', '..', '..');
const FIXTURES = join(ROOT, 'test', 'fixtures', 'calcs');
const fixtures = (dir: string) =>
  readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .map((f): [string, unknown] => [f, JSON.parse(readFileSync(join(dir, f), 'utf8'))]);
const INPUTS: [string, unknown][] = [
  ...fixtures(FIXTURES),
  ...fixtures(join(FIXTURES, 'edge-cases')),
  ['demo slurry pump', slurryPumpShaft()],
  ['demo mixer', mixerShaft()],
  ['demo conveyor head', conveyorHeadShaft()],
  ['demo hoist drum', hoistDrumShaft()],
];
const RULE_FILES = readdirSync(join(ROOT, 'rules'));

/** Every checklist the server would store for the fixtures and the demo shafts under every shipped standard. */
async function evaluateAll(): Promise<[string, Checklist][]> {
  const out: [string, Checklist][] = [];
  for (const file of RULE_FILES) {
    for (const [name, input] of INPUTS) {
      const { checklist } = await computeRecord(input, loadRuleSet(file));
      if (checklist) out.push([`${name} under ${file}`, checklist]);
    }
  }
  return out;
}

/** Equal values and the same text: the same keys in the same order, so every hash over it is the same. */
function expectExactly(read: unknown, evaluated: Checklist) {
  expect(isDeepStrictEqual(read, evaluated)).toBe(true);
  expect(JSON.stringify(read)).toBe(JSON.stringify(evaluated));
}

// Copied through JSON: under jest, structuredClone builds objects of another realm, which strict equality tells apart.
const copyOf = (c: Checklist): Checklist => JSON.parse(JSON.stringify(c));
let evaluated: Promise<[string, Checklist][]> | undefined;
const storedChecklists = () => (evaluated ??= evaluateAll());
const firstChecklist = async () => (await storedChecklists())[0][1];

describe('stored checklists', () => {
  it('when every fixture and demo checklist is stored and read, then each reads back exactly as evaluated', async () => {
    const all = await storedChecklists();
    expect(all.length).toBeGreaterThan(RULE_FILES.length * 8);
    for (const [name, checklist] of all) {
      const text = compactChecklist(checklist)!;
      expect([name, JSON.parse(text).storedRows?.form]).toEqual([name, 1]);
      expectExactly(expandChecklist(text), checklist);
    }
  });

  it('when a checklist of many rows is stored, then its text is under half the whole form', async () => {
    const [, big] = (await storedChecklists()).find(
      ([n]) => n === 'five-segment-fatigue.json under kfd-eng-014-v4.json',
    )!;
    expect(big.rows.length).toBeGreaterThan(40);
    expect(compactChecklist(big)!.length).toBeLessThan(JSON.stringify(big).length / 2);
  });

  it('when a row was stored whole (before this form), then it reads as it is', async () => {
    const checklist = await firstChecklist();
    const whole = JSON.stringify(checklist);
    expectExactly(expandChecklist(whole), checklist);
    expect(expandChecklist(null)).toBeNull();
  });

  it('when rows hold errors, warnings, quotes and no unit basis, then they read back exactly', async () => {
    const checklist = await firstChecklist();
    const odd = copyOf(checklist);
    Object.assign(odd.rows[0], { status: 'error', utilisationBasis: null, message: 'could not be evaluated: "x"' });
    odd.rows[1].warnings.push('segments[1]: fit used outside its range', 'a second «warning» – with ünïcode');
    odd.rows[1].location = { ...odd.rows[1].location, label: 'segment 2 "gear \\ seat" (40–160 mm)', index: 1, at: 0 };
    expectExactly(expandChecklist(compactChecklist(odd)), odd);
  });

  it.each([
    ['an extra key', (c: Checklist) => Object.assign(c.rows[0], { extra: 1 })],
    [
      'keys in another order',
      (c: Checklist) => {
        const { clauseId, ...rest } = c.rows[0];
        c.rows[0] = { ...rest, clauseId };
      },
    ],
    ['a value left undefined', (c: Checklist) => Object.assign(c.rows[0], { unit: undefined })],
    ['a number where text belongs', (c: Checklist) => Object.assign(c.rows[0], { message: 3 })],
    ['a location of another shape', (c: Checklist) => Object.assign(c.rows[0], { location: { scope: 'shaft' } })],
  ])('when a row has %s, then the checklist is stored whole and reads back as JSON gives it', async (_, change) => {
    const odd = copyOf(await firstChecklist());
    change(odd);
    const text = compactChecklist(odd)!;
    expect(text).toBe(JSON.stringify(odd));
    expect(expandChecklist(text)).toEqual(JSON.parse(JSON.stringify(odd)));
  });

  it('when a stored row holds a number that is not finite, then storing refuses as the whole form did', async () => {
    const odd = copyOf(await firstChecklist());
    odd.rows[2].actual = Number.NaN;
    expect(() => compactChecklist(odd)).toThrow(/refusing to store a non-finite number at rows\[2\]/);
  });

  it('when a stored form is not known, then reading refuses rather than guessing', async () => {
    const text = compactChecklist(await firstChecklist())!.replace('"form":1', '"form":9');
    expect(() => expandChecklist(text)).toThrow('Stored checklist rows are in unknown form 9');
  });
});
