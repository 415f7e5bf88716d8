import type { Sequelize, Transaction } from 'sequelize';
import type { AppAbility } from '../../shared/authz/app-ability';
import {
  HEALTH_SETTING_FIELDS,
  type HealthSettingKey,
  type HealthSettings,
  type HealthSettingsDto,
  type UpdateHealthSettings,
} from '../../shared/schemas/review-health.schema';
import { ReviewHealthSettings, User } from '../db/models';
import { AppError } from '../errors/app-error';
import { appendAudit, type Actor } from '../audit/audit.service';
import { runTransaction } from '../db/transaction';
import { forbiddenCheck } from '../authz/forbidden-check';

const KEYS = Object.keys(HEALTH_SETTING_FIELDS) as HealthSettingKey[];

export function settingsOf(row: ReviewHealthSettings): HealthSettings {
  return Object.fromEntries(KEYS.map((k) => [k, row[k]])) as HealthSettings;
}

/** The one settings row; the migration creates it, so its absence is a broken install, not bad input. */
export async function loadHealthSettings(transaction?: Transaction): Promise<ReviewHealthSettings> {
  const row = await ReviewHealthSettings.findByPk(1, { transaction, lock: transaction?.LOCK.UPDATE });
  if (!row) throw new Error('review_health_settings has no row 1; run the migrations');
  return row;
}

async function toDto(row: ReviewHealthSettings): Promise<HealthSettingsDto> {
  const by = row.updatedBy ? await User.findByPk(row.updatedBy, { attributes: ['displayName'] }) : null;
  return {
    ...settingsOf(row),
    lockVersion: row.lockVersion,
    updatedAt: row.updatedAt.toISOString(),
    updatedBy: by?.displayName ?? null,
  };
}

/** Reads and changes the thresholds; each change is an audit entry naming every value before and after. */
export class HealthSettingsService {
  constructor(private readonly sequelize: Sequelize) {}

  async get(ability: AppAbility): Promise<HealthSettingsDto> {
    forbiddenCheck(ability)
      .setMessage('Review-health settings are for compliance and administrators')
      .throwUnlessCan('read', 'HealthSettings');
    return toDto(await loadHealthSettings());
  }

  async update(
    ability: AppAbility,
    actor: Actor & { id: number },
    dto: UpdateHealthSettings,
  ): Promise<HealthSettingsDto> {
    forbiddenCheck(ability)
      .setMessage('Review-health settings are changed by compliance or administrators')
      .throwUnlessCan('update', 'HealthSettings');
    const { lockVersion, ...next } = dto;
    await runTransaction(this.sequelize, async (transaction) => {
      const row = await loadHealthSettings(transaction);
      if (row.lockVersion !== lockVersion)
        throw AppError.conflict(
          'The settings were changed by someone else since you opened them; reload and try again',
        );
      const before = settingsOf(row);
      const changed = KEYS.filter((k) => before[k] !== next[k]);
      if (changed.length === 0) return;
      row.set({ ...next, lockVersion: row.lockVersion + 1, updatedBy: actor.id });
      await row.save({ transaction });
      await appendAudit(
        this.sequelize,
        actor,
        {
          action: 'review_health.settings_changed',
          entityType: 'Settings',
          entityId: 'review-health',
          payload: { changed: Object.fromEntries(changed.map((k) => [k, { before: before[k], after: next[k] }])) },
        },
        transaction,
      );
    });
    return toDto(await loadHealthSettings());
  }
}
