// Which spec file each jest worker takes next. jest's own order puts the longest files first when it has timings
// from an earlier run in its cache, and the largest files first when it has none, as in a fresh clone or on CI.
// File size says little here: crash-signoff.spec.ts is mid-sized and runs for minutes (it restarts real server
// processes), so in a fresh clone it used to start late and run alone at the end while the other workers idled.
// The files below took longest in measured runs (DEVELOPERS.md, "Tests"); they go first, in this order, and every
// other file follows in jest's order. A missing or renamed file is simply not found: the order is never a test.
const Sequencer = require('@jest/test-sequencer').default;

const LONGEST_FIRST = [
  'test/server/crash-signoff.spec.ts',
  'test/server/evidence.spec.ts',
  'test/e2e/screens.spec.ts',
  'test/server/api-fuzz.spec.ts',
  'test/server/impact.spec.ts',
  'test/server/independent-model.spec.ts',
  'src/app/features/calcs/editor/revision-editor.spec.ts',
  // Measured 2 December 2026 on a quiet machine: 66, 63, 59, 58, 53, 46 and 46 s.
  'test/server/workflow-transitions.spec.ts',
  'test/e2e/whole-shaft.spec.ts',
  'test/e2e/review-health.spec.ts',
  'test/e2e/keyboard-signoff.spec.ts',
  'test/server/list-plans.spec.ts',
  'test/e2e/independent-model.spec.ts',
  'test/e2e/editor-fit.spec.ts',
];

class LongestFirstSequencer extends Sequencer {
  sort(tests) {
    const rank = (test) => {
      const i = LONGEST_FIRST.findIndex((file) => test.path.endsWith(file));
      return i === -1 ? LONGEST_FIRST.length : i;
    };
    const jestOrder = super.sort([...tests]);
    return jestOrder
      .map((test, position) => ({ test, position }))
      .sort((a, b) => rank(a.test) - rank(b.test) || a.position - b.position)
      .map(({ test }) => test);
  }
}

module.exports = LongestFirstSequencer;
