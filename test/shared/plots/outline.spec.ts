import { shaftOutline, featureTag, type OutlineInput } from '../../../shared/plots';

const conveyor: OutlineInput = {
  segments: [
    { label: 'bearing', length: 40, od: 35, id: 0 },
    { label: 'hub seat', length: 120, od: 45, id: 0 },
    { label: 'collar', length: 60, od: 55, id: 20 },
  ],
  features: [
    { type: 'keyseat', form: 'end-mill', at: 100, width: 14, height: 9, length: 50 },
    { type: 'shoulder-fillet', at: 160, r: 1.5 },
    { type: 'ring-groove', at: 20, depth: 1.05, r: 0.2, width: 1.85 },
    { type: 'cross-hole', at: 190, diameter: 6, label: 'grease' },
    { type: 'shoulder-fillet', at: 165, r: 2 },
  ],
};

describe('shaft outline to scale', () => {
  const o = shaftOutline(conveyor);

  it('when drawn, then each segment is a rectangle at its station, as long as the segment and as high as its diameter', () => {
    expect(o.segments.map((s) => [s.x, s.width, s.y, s.height])).toEqual([
      [0, 40, -17.5, 35],
      [40, 120, -22.5, 45],
      [160, 60, -27.5, 55],
    ]);
    expect([o.length, o.maxRadius]).toEqual([220, 27.5]);
  });

  it('when a segment is hollow, then its bore is a separate rectangle for the hidden lines', () => {
    expect(o.bores).toEqual([{ x: 160, y: -10, width: 60, height: 20 }]);
  });

  it('when features are marked, then each gets a short tag, a name and the radius of its section', () => {
    expect(o.features.map((f) => [f.tag, f.top])).toEqual([
      ['KS1', 22.5],
      ['SF2', 22.5],
      ['RG3', 17.5],
      ['CH4', 27.5],
      ['SF5', 27.5],
    ]);
    expect(o.features[3].name).toBe('Cross hole, grease');
    expect(featureTag('keyseat', 0)).toBe('KS1');
  });

  it('when a keyseat has length and key height, then its seat is drawn h/2 deep centred on the station', () => {
    expect(o.features[0].shapes).toEqual([{ kind: 'rect', x: 75, y: 18, width: 50, height: 4.5 }]);
  });

  it('when a fillet sits at a shoulder, then two quarter circles of radius r join the smaller diameter to the shoulder face', () => {
    const [top, bottom] = o.features[1].shapes;
    if (top.kind !== 'polyline' || bottom.kind !== 'polyline') throw new Error('expected polylines');
    expect(top.points[0][0]).toBeCloseTo(158.5, 9);
    expect(top.points[0][1]).toBeCloseTo(22.5, 9);
    expect(top.points[8][0]).toBeCloseTo(160, 9);
    expect(top.points[8][1]).toBeCloseTo(24, 9);
    expect(bottom.points[8][1]).toBeCloseTo(-24, 9);
  });

  it('when a fillet is not at a joint, then nothing is drawn for it but it keeps its tag', () => {
    expect(o.features[4].shapes).toEqual([]);
  });

  it('when a groove has a width, then notches are cut at top and bottom; a cross hole is a circle on the axis', () => {
    expect(o.features[2].shapes).toHaveLength(2);
    expect(o.features[2].shapes[0]).toMatchObject({ kind: 'rect', width: 1.85, height: 1.05 });
    expect(o.features[3].shapes).toEqual([{ kind: 'circle', cx: 190, cy: 0, r: 3 }]);
  });

  it('when tags are close together, then they go on different label rows', () => {
    const f = Object.fromEntries(o.features.map((x) => [x.tag, x.level]));
    expect(f['SF2']).not.toBe(f['SF5']);
    expect(f['RG3']).toBe(0);
  });
});
