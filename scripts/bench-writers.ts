// Concurrent-writers benchmark (part of npm run bench): 20 writers for 60 s, each running complete
// sign-offs (create, save, upload, submit, tick, check, approve) against one app over HTTP, all in
// the same project and standard, so they contend on the same rows. Prints answers by status and
// the transactions the server ran again. Target: no answer of 500.
import type { AddressInfo } from 'node:net';
import { performance } from 'node:perf_hooks';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { createMigrator } from '../server/db/migrator';
import { createApp } from '../server/app';
import { retryStats } from '../server/db/transaction';
import { ApiClient, newTally } from './cluster/client';
import { signOff } from './cluster/signoff';
import { newLedger } from './cluster/signoff-steps';
import { setUpData } from './cluster/setup-data';

const WRITERS = Number(process.env.BENCH_WRITERS ?? 20);
const SECONDS = Number(process.env.BENCH_WRITER_SECONDS ?? 60);

async function main(): Promise<void> {
  const env = { ...process.env, LOGIN_RATE_LIMIT: '100000' };
  const config = loadConfig(env);
  const migrating = createSequelize(config);
  await createMigrator(migrating).up();
  await migrating.close();
  const stamp = Date.now().toString(36).toUpperCase();
  const data = await setUpData(env, WRITERS, { code: `W-${stamp}`, name: 'Writers bench' });
  const sequelize = createSequelize(config);
  const server = createApp({ sequelize, config }).listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  const tally = newTally();
  const ledger = newLedger();
  const failures: string[] = [];
  let signOffs = 0;
  let n = 0;
  const end = performance.now() + SECONDS * 1000;
  const writer = async (i: number) => {
    const team = {
      author: new ApiClient(base, tally),
      checker: new ApiClient(base, tally),
      approver: new ApiClient(base, tally),
      password: data.password,
    };
    await team.author.signIn(data.teams[i].author, data.password);
    await team.checker.signIn(data.teams[i].checker, data.password);
    await team.approver.signIn(data.teams[i].approver, data.password);
    while (performance.now() < end) {
      try {
        await signOff(
          team,
          { projectId: data.projectId, ruleSetId: data.ruleSetId, input: data.input, number: `B-${stamp}-${++n}` },
          ledger,
        );
        signOffs++;
      } catch (err) {
        failures.push((err as Error).message);
      }
    }
  };
  const before = { ...retryStats, byCause: { ...retryStats.byCause } };
  const t0 = performance.now();
  await Promise.all(Array.from({ length: WRITERS }, (_v, i) => writer(i)));
  const seconds = (performance.now() - t0) / 1000;
  server.close();
  await sequelize.close();

  const requests = Object.values(tally.byStatus).reduce((a, b) => a + b, 0);
  const causes =
    Object.entries(retryStats.byCause)
      .map(([k, v]) => `${k}: ${v - (before.byCause[k] ?? 0)}`)
      .join(', ') || 'none';
  console.log(
    `Concurrent writers: ${WRITERS} writers for ${seconds.toFixed(1)} s (save, upload, sign, tick in complete sign-offs, one project)`,
  );
  console.log(
    `  requests ${requests}, by status ${JSON.stringify(tally.byStatus)}; responses of 500: ${tally.byStatus['500'] ?? 0} (target 0)`,
  );
  console.log(
    `  complete sign-offs ${signOffs} (${(signOffs / seconds).toFixed(2)}/s); saves ${ledger.saves.length}, uploads ${ledger.attachments.length}, ticks ${ledger.ticks.length}, signatures ${ledger.signatures.length}`,
  );
  console.log(
    `  write transactions ${retryStats.transactions - before.transactions}, run again ${retryStats.retries - before.retries} (by cause: ${causes}), abandoned with 503 ${retryStats.gaveUp - before.gaveUp}; slowest answer ${tally.slowestMs} ms`,
  );
  for (const f of [...new Set(failures)].slice(0, 5)) console.log(`  sign-off failed: ${f}`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
