import { evaluateShaft, type CalcInput } from '../../../../shared/engine';
import { shaftLoads, shaftOutline } from '../../../../shared/plots';
import { layoutOutline } from './outline-layout';
import { ARROW_PX, LOADS_ROOM, layoutLoads } from './loads-layout';

// An invented shaft: bearings at both ends, a downward force mid-span and a force along +z off-centre.
const INPUT: CalcInput = {
  units: 'SI',
  material: { E: 207, G: 79.3, Sy: 530, Su: 630 },
  segments: [{ length: 300, od: 40, id: 0 }],
  torques: [],
  supports: [
    { at: 0, kind: 'deep-groove-ball' },
    { at: 300, kind: 'deep-groove-ball' },
  ],
  loads: [
    { at: 150, Fy: -2000 },
    { at: 100, Fz: 500 },
  ],
};
const result = evaluateShaft(INPUT);
const outline = shaftOutline(INPUT);
const base = layoutOutline(outline, 640, LOADS_ROOM);
const l = layoutLoads(shaftLoads(result, outline), base);

const end = (d: string) => d.split(' L')[1].split(',').map(Number);

describe('force arrows in pixels', () => {
  it('when a force acts downwards, then its arrow comes from above, full length, and its head ends on the top surface', () => {
    const down = l.arrows.find((a) => a.tag === 'F1')!;
    const [x, y] = end(down.d);
    expect(x).toBeCloseTo(base.shaftLeft + 150 * base.scale, 0);
    expect(y).toBeCloseTo(base.centreY - 20 * base.scale, 0);
    const tailY = Number(down.d.split(',')[1].split(' ')[0]);
    expect(y - tailY).toBeCloseTo(ARROW_PX, 0);
  });

  it('when bearings react upwards, then their arrows come from below and stop outside the bearing marks, without a tag of their own', () => {
    const reactions = l.arrows.filter((a) => a.isReaction);
    expect(reactions).toHaveLength(2);
    for (const r of reactions) {
      const [, y] = end(r.d);
      expect(y).toBeGreaterThan(base.centreY + 20 * base.scale);
      expect(r.tag).toBe('');
    }
    expect(l.bearings.map((b) => b.tag)).toEqual(['B1', 'B2']);
  });

  it("when a force acts along +z, then the x–z strip below shows it as an upward arrow ending on the strip's axis, below the side view", () => {
    const [fz] = l.plan.arrows.filter((a) => !a.isReaction);
    expect(fz.tag).toBe('F2');
    const [x, tip] = end(fz.d);
    expect(x).toBeCloseTo(base.shaftLeft + 100 * base.scale, 0);
    expect(tip).toBeCloseTo(l.plan.y + 2, 0);
    expect(Number(fz.d.split(',')[1].split(' ')[0])).toBeGreaterThan(tip);
    expect(l.plan.y - 46 - 18).toBeGreaterThan(base.centreY + 20 * base.scale);
    expect(l.plan.supports).toHaveLength(2);
  });

  it('when room for arrows is asked for, then the picture grows by it above and below the shaft', () => {
    const plain = layoutOutline(outline, 640);
    expect(base.height - plain.height).toBeCloseTo(LOADS_ROOM.above + LOADS_ROOM.below, 6);
    expect(base.scale).toBeCloseTo(plain.scale, 12);
  });
});
