import type { Model, ModelStatic, Transaction } from 'sequelize';
import { plainRun } from './plain-query';

interface Internals {
  _previousDataValues: Record<string, unknown>;
}

/**
 * An instance's changed attributes written by primary key in one UPDATE sent past Sequelize's query pipeline
 * (plain-query.ts), as `instance.save({ transaction })` writes them: only what changed, with `updatedAt` set to now
 * (Sequelize keeps the milliseconds for MariaDB), and the instance then holding the written values as unchanged. A
 * revision's save went through `save()` at about 0.4 ms of the app's CPU (DEVELOPERS.md, "Measuring speed"). No
 * validator or hook runs: for values the app computed itself, never for a request's values as they came.
 */
export async function plainUpdate(instance: Model, transaction: Transaction): Promise<void> {
  const model = instance.constructor as ModelStatic<Model>;
  const attributes = model.getAttributes() as Record<string, { field?: string }>;
  if (!instance.changed()) return;
  if (attributes.updatedAt) instance.set('updatedAt' as never, new Date() as never);
  // As save() does: only the model's own attributes (a value hung on the instance by other code is not a column).
  const keys = (instance.changed() as string[]).filter((k) => attributes[k]);
  const key = model.primaryKeyAttribute;
  const column = (name: string) => `\`${attributes[name].field ?? name}\``;
  await plainRun(
    model.sequelize!,
    `UPDATE \`${model.getTableName() as string}\` SET ${keys.map((k) => `${column(k)} = ?`).join(', ')} WHERE ${column(key)} = ?`,
    [...keys.map((k) => instance.getDataValue(k as never)), instance.getDataValue(key as never)],
    transaction,
  );
  // As save() leaves it: what was written is the instance's unchanged state (Sequelize keeps it in a private field).
  const previous = (instance as unknown as Internals)._previousDataValues;
  for (const k of keys) {
    previous[k] = instance.getDataValue(k as never);
    instance.changed(k as never, false);
  }
}
