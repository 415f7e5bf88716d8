import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTableHarness } from '@angular/material/table/testing';
import { evaluateShaft, formatNumber, type CalcInput, type CalcResult } from '../../../../../shared/engine';
import { ShaftResults } from './shaft-results';

// An invented shaft in US units: a 2 in bar on two bearings with a spur gear, one bearing rating given.
const INPUT: CalcInput = {
  units: 'US',
  material: { E: 30, G: 11.5, Sy: 77, Su: 91 },
  segments: [{ length: 16, od: 2, id: 0 }],
  torques: [
    { at: 4, T: 4000 },
    { at: 12, T: -4000 },
  ],
  supports: [
    { at: 1, kind: 'deep-groove-ball', C: 6000, label: 'drive end' },
    { at: 15, kind: 'cylindrical-roller' },
  ],
  loads: [{ at: 4, kind: 'gear', pitchDiameter: 6 }],
  speed: 1200,
};

function render(result: CalcResult) {
  const fixture = TestBed.createComponent(ShaftResults);
  fixture.componentRef.setInput('result', result);
  fixture.detectChanges();
  return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
}

describe('whole-shaft results tables', () => {
  it("when a US calc is shown, then reactions and life carry the engine's units and values, and no rating gives a dash, never NaN", async () => {
    const r = evaluateShaft(INPUT);
    const { fixture, loader } = render(r);
    const table = await loader.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Bearing reactions and life"]' }),
    );
    const cells = await table.getCellTextByColumnName();
    expect(await (await table.getHeaderRows())[0].getCellTextByIndex()).toEqual([
      'Bearing',
      'at [in]',
      'Fy [lbf]',
      'Fz [lbf]',
      'F radial [lbf]',
      'Fa axial [lbf]',
      'slope [rad]',
      'L10 [10⁶ rev]',
      'L10h [h]',
    ]);
    expect(cells['tag'].text).toEqual(['B1 deep-groove ball, drive end', 'B2 cylindrical roller']);
    expect(cells['L10h'].text).toEqual([formatNumber(r.supports[0].L10h!, 3), '—']);
    const text = fixture.nativeElement.textContent as string;
    expect(text).toContain(formatNumber(r.criticalSpeed!.rpm, 4));
    expect(text).toContain(r.criticalSpeed!.method);
    expect(text).not.toMatch(/NaN|Infinity|undefined/);
  });

  it("when the model's assumptions are listed, then each reads as a sentence and the caution sits with them", () => {
    const r = evaluateShaft(INPUT);
    const items = [...render(r).fixture.nativeElement.querySelectorAll('tt-model-assumptions li')].map((li: Element) =>
      li.textContent!.trim(),
    );
    expect(items).toHaveLength(r.assumptions.length);
    for (const i of items) expect(i).toMatch(/^[A-Z].*\.$/);
    expect(render(r).fixture.nativeElement.querySelector('tt-model-assumptions tt-safety-note')).not.toBeNull();
  });

  it('when a result was stored before bearings existed, then nothing is shown and nothing throws', () => {
    const { supports: _s, loads: _l, ...old } = evaluateShaft({ ...INPUT, supports: undefined, loads: undefined });
    const { fixture } = render(old as CalcResult);
    expect(fixture.nativeElement.textContent.trim()).toBe('');
  });
});
