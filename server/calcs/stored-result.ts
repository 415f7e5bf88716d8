import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { ENGINE_VERSION, type CalcResult } from '../../shared/engine';
import { FIELDS } from '../../shared/engine/fields';
import { METHODS } from '../../shared/engine/methods';
import { expandStoredResult, type EngineMetadata, type StoredResult } from '../../shared/engine/stored-result';
import { stringifyFinite } from '../../shared/json/finite-json';

/**
 * Stored results leave out `fields` (unit and formula of each result field) and `methods`: they
 * belong to the engine version, not to the row, and are kept once per version in engine_metadata.
 * Reading puts them back exactly as the engine returned them, so content hashes (which cover the
 * whole result) are the same as before; rows stored with them in place are read as they are.
 */
// Read from the table, not from the code, so an engine edit that forgot to bump the version cannot change old hashes.
const known = new Map<string, EngineMetadata>();
let registered: Promise<void> | null = null;

/** The compact text a revision row keeps. */
export function compactResult(result: CalcResult | null): string | null {
  if (!result) return null;
  const { fields: _f, methods: _m, ...rest } = result;
  return stringifyFinite(rest);
}

/** Records this engine version's metadata once per process, so later engine versions can still read these rows. */
// Outside the caller's transaction: the row must outlive a rolled-back save.
export function registerEngineMetadata(sequelize: Sequelize): Promise<void> {
  registered ??= sequelize
    .query(
      'INSERT IGNORE INTO engine_metadata (engine_version, fields, methods, created_at) VALUES (?, ?, ?, UTC_TIMESTAMP(3))',
      { replacements: [ENGINE_VERSION, JSON.stringify(FIELDS), JSON.stringify(METHODS)] },
    )
    .then(
      () => undefined,
      (err) => {
        registered = null;
        throw err;
      },
    );
  return registered;
}

/** An engine version's units and formulas as recorded, or null for a version that has stored no result here. */
export async function recordedMetadataOf(
  sequelize: Sequelize,
  version: string,
  transaction?: Transaction,
): Promise<EngineMetadata | null> {
  const cached = known.get(version);
  if (cached) return cached;
  const [row] = await sequelize.query<{ fields: string; methods: string }>(
    'SELECT fields, methods FROM engine_metadata WHERE engine_version = ?',
    { replacements: [version], type: QueryTypes.SELECT, transaction },
  );
  if (!row && version === ENGINE_VERSION) return { fields: FIELDS, methods: METHODS };
  if (!row) return null;
  const meta: EngineMetadata = { fields: JSON.parse(row.fields), methods: JSON.parse(row.methods) };
  known.set(version, meta);
  return meta;
}

async function metadataOf(sequelize: Sequelize, version: string, transaction?: Transaction): Promise<EngineMetadata> {
  const meta = await recordedMetadataOf(sequelize, version, transaction);
  if (!meta) throw new Error(`No unit and formula metadata is recorded for engine version ${version}`);
  return meta;
}

/** A stored result as the engine returned it (with `fields` and `methods`). */
export async function expandResult(
  sequelize: Sequelize,
  text: string | null,
  transaction?: Transaction,
): Promise<CalcResult | null> {
  if (!text) return null;
  const stored = JSON.parse(text) as StoredResult;
  if (stored.fields) return stored as CalcResult;
  return expandStoredResult(stored, await metadataOf(sequelize, stored.engineVersion, transaction));
}
