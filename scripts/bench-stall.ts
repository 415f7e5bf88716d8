// Event-loop benchmark (part of npm run bench): GET /api/session latency on a real listening server
// while four evidence packs (each unpacking ~150 MiB) and four report PDFs are processed. Prints figures only.
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { monitorEventLoopDelay, performance } from 'node:perf_hooks';
import { PassThrough } from 'node:stream';
import request from 'supertest';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { createMigrator } from '../server/db/migrator';
import { createApp } from '../server/app';
import { RuleSetRecord, User, UserRole, Project } from '../server/db/models';
import { seedRuleSets } from '../server/rule-sets/seed-rule-sets';
import { hashPassword } from '../server/auth/password';
import { writeZip } from '../server/evidence/evidence.service';
import { MANIFEST_FORMAT } from '../server/evidence/pack-verify';
import { latencySummary, sampleSession } from './bench-latency';

const PACKS = 4;
const REPORTS = 4;
const UNPACKED_MIB = Number(process.env.BENCH_PACK_MIB ?? 150);
const PASSWORD = 'bench only password';

/** A pack whose one large file compresses to almost nothing but unpacks (and hashes) to UNPACKED_MIB. */
async function bigPack(): Promise<Buffer> {
  const big = Buffer.alloc(UNPACKED_MIB * 1024 * 1024, 0x20);
  const manifest = {
    format: MANIFEST_FORMAT,
    calc: 'BENCH',
    exportedAt: new Date().toISOString(),
    exportedBy: 'bench',
    files: [{ path: 'attachments/scan.bin', sha256: createHash('sha256').update(big).digest('hex'), size: big.length }],
  };
  const manifestBytes = Buffer.from(JSON.stringify(manifest));
  const files = new Map([
    ['attachments/scan.bin', big],
    ['manifest.json', manifestBytes],
    ['manifest.sha256', Buffer.from(createHash('sha256').update(manifestBytes).digest('hex'))],
  ]);
  const out = new PassThrough();
  const chunks: Buffer[] = [];
  out.on('data', (c: Buffer) => chunks.push(c));
  await writeZip(files, out);
  return Buffer.concat(chunks);
}

async function main(): Promise<void> {
  const config = { ...loadConfig(), EVIDENCE_PACK_MAX_MB: 100 };
  const sequelize = createSequelize(config);
  await createMigrator(sequelize).up();
  await seedRuleSets(sequelize);
  const user = await User.create({
    username: `stall-${Date.now()}`,
    displayName: 'Bench Author',
    email: 'bench@example.test',
    passwordHash: await hashPassword(PASSWORD),
  });
  await UserRole.create({ userId: user.id, role: 'author' });
  const project = await Project.create({ code: `STALL-${Date.now()}`, name: 'Benchmark project', createdBy: null });
  const server = createApp({ sequelize, config }).listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const agent = request.agent(`http://127.0.0.1:${(server.address() as AddressInfo).port}`);
  const token = (await agent.get('/api/session')).body.csrfToken;
  const csrf = (
    await agent
      .post('/api/auth/login')
      .set('x-csrf-token', token)
      .send({ username: user.username, password: PASSWORD })
      .expect(200)
  ).body.csrfToken;
  const input = JSON.parse(
    readFileSync(join(__dirname, '..', 'test', 'fixtures', 'calcs', 'five-segment-fatigue.json'), 'utf8'),
  );
  const ruleSet = (await RuleSetRecord.findOne({
    where: { code: 'KFD-ENG-014', status: 'effective' },
    order: [['version', 'DESC']],
  }))!;
  const calc = await agent
    .post('/api/calcs')
    .set('x-csrf-token', csrf)
    .send({ projectId: project.id, number: 'B-1', title: 'Benchmark shaft', partRef: '', ruleSetId: ruleSet.id, input })
    .expect(201);
  const pack = await bigPack();

  const idle = await sampleSession(agent, 3000);
  global.gc?.();
  const startRss = process.memoryUsage().rss;
  let peakRss = startRss;
  // The server runs in this process: its event-loop delay separates a blocked loop from a busy machine.
  const loopDelay = monitorEventLoopDelay({ resolution: 5 });
  loopDelay.enable();
  const rssTimer = setInterval(() => {
    peakRss = Math.max(peakRss, process.memoryUsage().rss);
  }, 20);
  const t0 = performance.now();
  const heavy = Promise.all([
    ...Array.from({ length: PACKS }, () =>
      agent.post('/api/verify/pack').set('x-csrf-token', csrf).attach('file', pack, 'pack.zip').expect(200),
    ),
    ...Array.from({ length: REPORTS }, () => agent.get(`/api/revisions/${calc.body.latest.id}/report.pdf`).expect(200)),
  ]);
  const loaded = await sampleSession(agent, heavy);
  await heavy;
  const wall = performance.now() - t0;
  clearInterval(rssTimer);
  loopDelay.disable();

  console.log(
    `Event loop under heavy work · ${PACKS} evidence packs (${UNPACKED_MIB} MiB unpacked each, ${(pack.length / 1024).toFixed(0)} KiB zipped) and ${REPORTS} report PDFs at once`,
  );
  console.log(latencySummary('GET /api/session, idle      ', idle));
  console.log(latencySummary('GET /api/session, under load', loaded));
  console.log(
    `  event-loop delay under load: p50 ${(loopDelay.percentile(50) / 1e6).toFixed(1)} ms · p99 ${(loopDelay.percentile(99) / 1e6).toFixed(1)} ms · max ${(loopDelay.max / 1e6).toFixed(1)} ms`,
  );
  console.log(
    `  heavy work done in ${(wall / 1000).toFixed(1)} s with ${config.WORK_THREADS} worker threads; resident memory of the process (server, workers and this client) ${(startRss / 1048576).toFixed(0)} MiB before, ${(peakRss / 1048576).toFixed(0)} MiB at peak (target p99 < 50 ms)`,
  );
  server.close();
  await sequelize.close();
  process.exit(0);
}

main().catch((err) => {
  console.error(`event-loop benchmark failed: ${(err instanceof Error ? err.message : String(err)).slice(0, 400)}`);
  process.exit(1);
});
