import type { Sequelize } from 'sequelize';
import type { Writable } from 'node:stream';
import type { AppAbility } from '../../shared/authz/app-ability';
import { appendAudit, type Actor } from '../audit/audit.service';
import type { ObjectStore } from '../attachments/object-store';
import type { ReportService } from '../reports/report.service';
import type { ReportContext } from '../reports/report-data';
import { packContents, readme } from './pack-contents';
import { MANIFEST_FORMAT, type Manifest } from './pack-verify';
import { sha256 } from './record-json';
import { forbiddenCheck } from '../authz/forbidden-check';

export interface SealedPack {
  fileName: string;
  files: Map<string, Buffer>;
  sealHash: string;
}

/**
 * Evidence packs for compliance: the whole record of a calc in one zip, sealed by the SHA-256 of
 * its manifest. The seal goes into the audit trail when the pack is made, so a pack altered
 * later — even with a rewritten manifest — no longer matches anything on record.
 */
export class EvidenceService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly store: ObjectStore,
    private readonly reports: ReportService,
  ) {}

  async build(
    ability: AppAbility,
    actor: Actor & { id: number },
    calcId: number,
    ctx: ReportContext,
  ): Promise<SealedPack> {
    forbiddenCheck(ability).setMessage('Evidence packs are exported by compliance').throwUnlessCan('audit', 'Calc');
    const { calc, files } = await packContents(ability, calcId, this.store, this.reports, ctx);
    const label = `${calc.Project.code} ${calc.number}`;
    const exportedAt = new Date().toISOString();
    files.set('README.txt', readme(label, actor.name, exportedAt));
    const manifest: Manifest = {
      format: MANIFEST_FORMAT,
      calc: label,
      exportedAt,
      exportedBy: actor.name,
      files: [...files].map(([path, data]) => ({ path, sha256: sha256(data), size: data.length })),
    };
    const manifestBytes = Buffer.from(`${JSON.stringify(manifest, null, 2)}\n`, 'utf8');
    const sealHash = sha256(manifestBytes);
    files.set('manifest.json', manifestBytes);
    files.set('manifest.sha256', Buffer.from(`${sealHash}\n`));
    await appendAudit(this.sequelize, actor, {
      action: 'evidence.exported',
      entityType: 'Calc',
      entityId: calc.id,
      payload: { calc: label, manifestSha256: sealHash, files: manifest.files.length },
    });
    const fileName = `evidence_${label.replace(/[^A-Za-z0-9._-]+/g, '-')}_${exportedAt.slice(0, 10)}.zip`;
    return { fileName, files, sealHash };
  }
}

/** Streams the pack as a zip; every entry is already in memory, so this cannot fail half-way for data. */
export async function writeZip(files: Map<string, Buffer>, out: Writable): Promise<void> {
  // Loaded on first export, not with the server (issue 14: every process and test app paid for it at start).
  const { default: archiver } = await import('archiver');
  const zip = archiver('zip', { zlib: { level: 6 } });
  const done = new Promise<void>((resolve, reject) => {
    out.on('finish', resolve);
    zip.on('error', reject);
  });
  zip.pipe(out);
  const now = new Date();
  for (const [name, data] of files) zip.append(data, { name, date: now });
  await zip.finalize();
  await done;
}
