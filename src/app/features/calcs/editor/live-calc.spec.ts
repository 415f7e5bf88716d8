import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { validateCalcInput } from '../../../../../shared/engine';
import { TWO_STEP_SHAFT } from '../../../../../test/support/editor-harness';
import { liveCalc, loadLiveEngine } from './live-calc';

// A bore larger than its segment: the shared input schema names the field and says why.
const BAD = {
  ...TWO_STEP_SHAFT,
  torques: [
    { at: 50, T: 1500 },
    { at: 350, T: -1500 },
  ],
  segments: [TWO_STEP_SHAFT.segments[0], { label: 'body', length: 300, od: 70, id: 80 }],
};
const GOOD = { ...BAD, segments: TWO_STEP_SHAFT.segments };

describe('the live calc with its validating engine loaded on its own', () => {
  it('when the engine has not arrived, then nothing is judged; then the shared schema’s messages', async () => {
    const input = signal<Record<string, unknown>>(BAD);
    const live = TestBed.runInInjectionContext(() => liveCalc(input, signal(null)));
    expect(live.issues()).toEqual([]);
    expect(live.evaluated()).toBeNull();

    await loadLiveEngine();
    const expected = validateCalcInput(BAD);
    expect(expected.ok).toBe(false);
    expect(live.issues()).toEqual(expected.ok ? [] : expected.issues);
    expect(live.issues().length).toBeGreaterThan(0);

    input.set(GOOD);
    expect(live.issues()).toEqual([]);
    expect(live.evaluated()?.result.segments).toHaveLength(2);
  });
});
