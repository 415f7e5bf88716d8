// `npm run test:cluster` (through scripts/test-cluster.sh): three Galera nodes, HAProxy, two app
// instances, four clients doing complete sign-offs while one database node and one app instance
// are killed with SIGKILL and brought back. Prints what it saw; exits 1 on any broken promise.
import path from 'node:path';
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { GaleraCluster } from './galera';
import { serverStates, startHaproxy, startNodeChecks } from './haproxy';
import { Processes, freePort, waitFor } from './processes';
import { newTally } from './client';
import { newLedger } from './signoff-steps';
import { setUpData } from './setup-data';
import { verifyChainOn, verifyNode } from './verify';
import { AppInstances } from './apps';
import { startWorkload } from './workload';

const CLIENTS = 4;
const SIGN_OFFS = 100;
const DB = { name: 'torquetrail_cluster', user: 'torquetrail_cluster', password: 'cluster-only' };

async function main(root: string): Promise<number> {
  const t0 = Date.now();
  const since = () => `${((Date.now() - t0) / 1000).toFixed(1)} s`;
  const log = (m: string) => console.log(`[cluster ${since()}] ${m}`);
  const procs = new Processes(path.join(root, 'pids'));
  const cluster = await GaleraCluster.create(procs, root);
  const [db1, db2, db3] = cluster.nodes;
  try {
    await cluster.start(db1, true);
    await cluster.waitSynced(db1);
    await cluster.query(db1, `CREATE DATABASE ${DB.name} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    await cluster.query(db1, `CREATE USER '${DB.user}'@'127.0.0.1' IDENTIFIED BY '${DB.password}'`);
    await cluster.query(db1, `GRANT ALL PRIVILEGES ON ${DB.name}.* TO '${DB.user}'@'127.0.0.1'`);
    for (const node of [db2, db3]) {
      await cluster.start(node);
      await cluster.waitSynced(node);
    }
    log('three database nodes Synced (the second and third joined by full state transfer)');

    const checks = await startNodeChecks(cluster);
    const appPorts = [await freePort(), await freePort()];
    const ends = await startHaproxy(procs, cluster, checks.ports, appPorts, root);
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      DB_HOST: '127.0.0.1',
      DB_PORT: String(ends.dbPort),
      DB_NAME: DB.name,
      DB_USER: DB.user,
      DB_PASSWORD: DB.password,
      NODE_ENV: 'production',
      LOG_LEVEL: 'warn',
      MAIL_SENDER: 'false',
      LOGIN_RATE_LIMIT: '1000',
      SESSION_SECRET: 'cluster-test-session-secret',
      PUBLIC_URL: `http://127.0.0.1:${ends.webPort}`,
    };
    await waitFor('HAProxy to route to the writer node', async () => (await serverStates(ends))['galera/db1'] === 'UP');
    // Not execFileSync: this process answers HAProxy's node checks and must keep its event loop free.
    await promisify(execFile)(process.execPath, ['--import', 'tsx', 'server/db/migrate.ts', 'up'], { env });
    const data = await setUpData(env, CLIENTS);
    const apps = new AppInstances(procs, env, appPorts, root);
    await Promise.all(apps.ports.map((_p, i) => apps.start(i)));
    await waitFor(
      'HAProxy to see both app instances',
      async () =>
        Object.entries(await serverStates(ends)).filter(([k, v]) => k.startsWith('web/') && v === 'UP').length === 2,
    );
    log(`ready: HAProxy db :${ends.dbPort}, web :${ends.webPort}; ${CLIENTS} clients start ${SIGN_OFFS} sign-offs`);

    const tally = newTally();
    const ledger = newLedger();
    const base = `http://127.0.0.1:${ends.webPort}`;
    const runStart = Date.now();
    const work = startWorkload(base, data, { clients: CLIENTS, signOffs: SIGN_OFFS, tally, ledger });
    const completed = work.completed;
    const reached = (n: number) => waitFor(`${n} sign-offs`, async () => completed() >= n, 900_000, 100);
    const events: string[] = [];
    const note = (m: string) => {
      events.push(`${since()} ${m}`);
      log(m);
    };
    const faults = async () => {
      await reached(15);
      note(`SIGKILL database node db1 (the writer) after ${completed()} sign-offs`);
      await cluster.kill(db1);
      await reached(30);
      const down = Date.now();
      await cluster.start(db1);
      await cluster.waitSynced(db1);
      note(`db1 restarted and Synced again in ${((Date.now() - down) / 1000).toFixed(1)} s (incremental transfer)`);
      await reached(45);
      note(`SIGKILL app instance 1 after ${completed()} sign-offs`);
      await apps.kill(0);
      await reached(60);
      await apps.start(0);
      note('app instance 1 restarted and healthy');
    };
    await Promise.all([work.done, faults()]);
    const runSeconds = (Date.now() - runStart) / 1000;
    log(
      `${completed()} sign-offs done in ${runSeconds.toFixed(1)} s; responses by status ${JSON.stringify(tally.byStatus)}; slowest ${tally.slowestMs} ms`,
    );

    for (const line of tally.noAnswer) log(`no HTTP answer: ${line}`);
    for (const line of tally.cutMidAnswer) log(`answer cut off mid-body by the killed instance (retried): ${line}`);
    for (const node of cluster.nodes) await cluster.waitSynced(node);
    const problems: string[] = [];
    if (tally.hangs) problems.push(`${tally.hangs} requests waited longer than 10 s`);
    // Every request gets its answer or a 503 it may retry; a connection closed without a word is a failure.
    if (tally.noAnswer.length) problems.push(`${tally.noAnswer.length} requests got no HTTP answer`);
    if (tally.unclean503) problems.push(`${tally.unclean503} responses of 503 without Retry-After`);
    if (tally.byStatus['500']) problems.push(`${tally.byStatus['500']} responses of 500`);
    const prints = new Set<string>();
    for (const node of cluster.nodes) {
      const { problems: p, fingerprint } = await verifyNode(cluster, node, DB.name, data.projectId, ledger);
      problems.push(...p);
      prints.add(fingerprint);
      const chain = await verifyChainOn(node, env);
      if (!chain.ok) problems.push(`${node.name}: audit chain broken at ${chain.brokenAt}`);
      log(
        `${node.name}: ${p.length ? `${p.length} problems` : 'every check holds'}; audit chain ${chain.ok ? 'verifies' : 'BROKEN'} (${chain.checked} entries)`,
      );
    }
    if (prints.size !== 1) problems.push(`nodes disagree: ${[...prints].join(' | ')}`);
    const retries = apps.retryCounts();
    log(`transaction retries logged by the app instances: ${JSON.stringify(retries)}`);
    console.log(`\nCluster run: ${since()} in all; events:\n  ${events.join('\n  ')}`);
    for (const p of problems) console.log(`PROBLEM: ${p}`);
    console.log(problems.length ? `\ncluster test FAILED (${problems.length} problems)` : '\ncluster test passed');
    checks.close();
    return problems.length ? 1 : 0;
  } finally {
    await procs.stopAll();
  }
}

main(process.argv[2])
  .then((code) => process.exit(code))
  .catch((err) => {
    console.error(`cluster test FAILED: ${err instanceof Error ? err.stack : String(err)}`);
    process.exit(1);
  });
