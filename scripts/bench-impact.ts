// Impact-analysis benchmark (part of npm run bench): 10,000 generated approved revisions in a
// throw-away MariaDB, re-evaluated under another version of the standard. Prints figures only.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { createMigrator } from '../server/db/migrator';
import { Calc, Project, Revision, RuleSetRecord, User } from '../server/db/models';
import { seedRuleSets } from '../server/rule-sets/seed-rule-sets';
import { ImpactService } from '../server/rule-sets/impact.service';
import { computeRecord } from '../server/calcs/revision-content';
import { stored as storedColumns } from '../server/calcs/calcs.service';
import { createAppAbility, defineRulesFor } from '../shared/authz/app-ability';

const COUNT = Number(process.env.BENCH_REVISIONS ?? 10_000);
const BATCH = 100;

async function main(): Promise<void> {
  const sequelize = createSequelize(loadConfig());
  await createMigrator(sequelize).up();
  await seedRuleSets(sequelize);
  const v3 = (await RuleSetRecord.findOne({ where: { code: 'KFD-ENG-014', version: 3 } }))!;
  const v2 = (await RuleSetRecord.findOne({ where: { code: 'KFD-ENG-014', version: 2 } }))!;
  const user = await User.create({
    username: `bench-${Date.now()}`,
    displayName: 'Benchmark',
    email: 'bench@example.test',
    passwordHash: 'x',
  });
  const project = await Project.create({ code: `BENCH-${Date.now()}`, name: 'Benchmark project', createdBy: null });
  const base = JSON.parse(
    readFileSync(join(__dirname, '..', 'test', 'fixtures', 'calcs', 'five-segment-fatigue.json'), 'utf8'),
  );
  const stored = await computeRecord(base, JSON.parse(v3.document));
  const columns = storedColumns(stored);
  const t0 = performance.now();
  for (let start = 0; start < COUNT; start += BATCH) {
    const calcs = await Calc.bulkCreate(
      Array.from({ length: Math.min(BATCH, COUNT - start) }, (_, i) => ({
        projectId: project.id,
        number: `B-${start + i}`,
        title: 'Generated shaft',
        partRef: '',
        createdBy: user.id,
      })),
    );
    // Each revision's body diameter varies a little, so the evaluations are not all identical.
    await Revision.bulkCreate(
      calcs.map((c, i) => {
        const input = {
          ...base,
          segments: base.segments.map((s: { od: number }, k: number) =>
            k === 3 ? { ...s, od: s.od + ((start + i) % 7) } : s,
          ),
        };
        return {
          calcId: c.id,
          seq: 0,
          label: 'A',
          status: 'approved' as const,
          authorId: user.id,
          ruleSetId: v3.id,
          input: JSON.stringify(input),
          ...columns,
          manualItems: '{}',
          reasonForChange: 'generated',
          contentHash: null,
          approvedAt: new Date(),
        };
      }),
    );
  }
  const seeded = performance.now() - t0;
  const ability = createAppAbility(defineRulesFor({ id: user.id, roles: ['compliance'] }));
  const impact = new ImpactService(sequelize);
  const t1 = performance.now();
  const report = await impact.analyse(ability, v2.id);
  const wall = performance.now() - t1;
  console.log(
    `Impact analysis · MariaDB · ${report.evaluated.toLocaleString('en-US')} approved revisions (generated in ${(seeded / 1000).toFixed(1)} s)`,
  );
  console.log(
    `  re-evaluated under ${report.ruleSet.code} v${report.ruleSet.version}: ${report.changed.toLocaleString('en-US')} change verdict or clause outcome`,
  );
  console.log(
    `  wall time end to end (read, engine, checklist, compare): ${(wall / 1000).toFixed(2)} s  (target ≤ 2 s for 10,000)`,
  );
  await sequelize.close();
}

main().catch((err) => {
  console.error(`impact benchmark failed: ${(err instanceof Error ? err.message : String(err)).slice(0, 400)}`);
  process.exit(1);
});
