import { MatInputHarness } from '@angular/material/input/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { evaluateShaft, formatNumber, type CalcInput } from '../../../../../shared/engine';
import { configureEditorTestBed, openEditor, storedRevision } from '../../../../../test/support/editor-harness';

// An invented countershaft with two bearings, a spur gear and a V-belt pulley.
const INPUT: CalcInput = {
  units: 'SI',
  material: { name: 'AISI 1045 CD', kind: 'steel', E: 207, G: 79.3, Sy: 530, Su: 630 },
  segments: [
    { length: 40, od: 40, id: 0 },
    { length: 300, od: 50, id: 0 },
    { length: 60, od: 40, id: 0 },
  ],
  torques: [
    { at: 120, T: 400 },
    { at: 300, T: -400 },
  ],
  supports: [
    { at: 20, kind: 'deep-groove-ball', C: 30 },
    { at: 380, kind: 'cylindrical-roller', C: 45 },
  ],
  loads: [
    { at: 120, kind: 'gear', pitchDiameter: 160 },
    { at: 300, kind: 'pulley', diameter: 250, direction: 90 },
  ],
  masses: [{ at: 120, mass: 6 }],
  speed: 900,
};

beforeEach(configureEditorTestBed);

type Opened = Awaited<ReturnType<typeof openEditor>>;

async function reactionCell(e: Opened, column: string, row: number): Promise<string> {
  const table = await e.loader.getHarness(
    MatTableHarness.with({ selector: '[aria-label="Bearing reactions and life"]' }),
  );
  return (await table.getCellTextByColumnName())[column].text[row];
}

const field = (e: Opened, path: string) =>
  e.loader.getHarness(MatInputHarness.with({ selector: `[data-path="${path}"]` }));

describe('bearings and forces in the calc editor', () => {
  it("when the calc has bearings and a gear, then the reactions table shows the engine's values, live as the pitch diameter changes", async () => {
    const e = await openEditor(storedRevision(INPUT));
    const before = evaluateShaft(INPUT).supports[0];
    expect(await reactionCell(e, 'F', 0)).toBe(formatNumber(before.F, 4));
    expect(await reactionCell(e, 'tag', 0)).toContain('B1');

    await (await field(e, 'loads[0].pitchDiameter')).setValue('200');
    await e.settle();

    const after = evaluateShaft({
      ...INPUT,
      loads: [{ ...INPUT.loads![0], pitchDiameter: 200 } as never, INPUT.loads![1]],
    }).supports[0];
    expect(after.F).toBeLessThan(before.F);
    expect(await reactionCell(e, 'F', 0)).toBe(formatNumber(after.F, 4));
    expect(e.fixture.nativeElement.textContent).not.toMatch(/NaN|Infinity/);
  });

  it("when a bearing's load rating is not positive, then the engine names the problem on that bearing's C field", async () => {
    const e = await openEditor(storedRevision(INPUT));
    await (await field(e, 'supports[1].C')).setValue('0');
    await e.settle();

    const rating = await e.loader.getHarness(
      MatFormFieldHarness.with({ selector: ':has([data-path="supports[1].C"])' }),
    );
    expect((await rating.getTextErrors()).join(' ')).toMatch(/0/);
    expect(await rating.isControlValid()).toBe(false);
    expect(e.fixture.nativeElement.textContent).toMatch(/Bearing 2, load rating C — C must be greater than 0/);
    expect(e.fixture.nativeElement.textContent).toContain('Results below are for the last valid input');
  });

  it("when a bearing is moved off the shaft, then the engine's message is on that bearing's station field, named as the screen names it", async () => {
    const e = await openEditor(storedRevision(INPUT));
    await (await field(e, 'supports[1].at')).setValue('450');
    await e.settle();

    const station = await e.loader.getHarness(
      MatFormFieldHarness.with({ selector: ':has([data-path="supports[1].at"])' }),
    );
    expect(await station.getTextErrors()).toEqual(['station 450 mm is off the shaft (0 to 400 mm)']);
    expect(e.fixture.nativeElement.textContent).toMatch(/Bearing 2, station — station 450 mm is off the shaft/);
  });

  it('when a force element becomes a sprocket, then its fields change to pitch diameter and pull factor, with its tag', async () => {
    const e = await openEditor(storedRevision(INPUT));
    await (await e.loader.getHarness(MatButtonHarness.with({ text: /Add force/ }))).click();
    const kind = await e.loader.getHarness(MatSelectHarness.with({ selector: '[data-path="loads[2].kind"]' }));
    await kind.open();
    await kind.clickOptions({ text: 'Chain sprocket' });
    await e.settle();

    const group = e.fixture.nativeElement.querySelector('[aria-label="Chain sprocket 3"]') as HTMLElement;
    expect(group.querySelector('.tag')?.textContent).toBe('S3');
    expect(group.querySelector('[data-path="loads[2].diameter"]')).not.toBeNull();
    expect(group.querySelector('[data-path="loads[2].Fy"]')).toBeNull();
    expect(group.textContent).toContain('blank: 1 (chain)');
  });

  it('when the units switch to US, then forces, ratings, masses and density are converted, not relabelled', async () => {
    const e = await openEditor(
      storedRevision({ ...INPUT, material: { ...INPUT.material, density: 7850 }, loads: [{ at: 120, Fy: -1000 }] }),
    );
    await (await e.loader.getHarness(MatButtonToggleHarness.with({ text: /^US/ }))).check();
    await e.settle();

    expect(Number(await (await field(e, 'loads[0].Fy')).getValue())).toBeCloseTo(-224.809, 3);
    expect(Number(await (await field(e, 'supports[0].C')).getValue())).toBeCloseTo(6744.27, 1);
    expect(Number(await (await field(e, 'masses[0].mass')).getValue())).toBeCloseTo(13.2277, 3);
    expect(Number(await (await field(e, 'material.density')).getValue())).toBeCloseTo(0.2836, 4);
    expect((e.fixture.nativeElement.querySelector('[aria-label="Bearing 1"]') as HTMLElement).textContent).toMatch(
      /C\s*lbf/,
    );
  });

  it('when the calc has bearings, then the outline names them and the forces, and the assumptions and caution sit by the results', async () => {
    const e = await openEditor(storedRevision(INPUT));
    const outline = e.fixture.nativeElement.querySelector('tt-shaft-drawing svg') as SVGElement;
    expect(outline.getAttribute('aria-label')).toMatch(
      /bearings B1 at 20 mm, B2 at 380 mm; forces on the shaft: G1 Gear: Fy/,
    );
    expect(outline.querySelectorAll('.arrow').length).toBeGreaterThanOrEqual(3);
    const text = e.fixture.nativeElement.textContent as string;
    expect(text).toContain('What this model assumes');
    expect(text).toContain('Bending moment from the forces');
    expect(text).toContain('First critical speed');
    expect(text).toContain('Critical / operating speed');
    expect(text).toContain('Largest deflection δ');
    expect(e.fixture.nativeElement.querySelector('tt-model-assumptions tt-safety-note')).not.toBeNull();
  });
});
