import { Utils, type FindOptions, type Model, type ModelStatic } from 'sequelize';

/*
 * A model query through Sequelize costs two to four times the CPU of the same statement sent plain (building the
 * query, cloning its options, building the instances), which on a hot read is most of the app's share. A hot read
 * may send its own statement instead and build the rows into the same instances, so everything after it is
 * unchanged (DEVELOPERS.md, "Measuring speed"). Values are parsed by the same type casts either way.
 */

/** A model's columns under its attribute names, read from table `alias`, leaving out the attributes in `exclude`. */
export function columnsOf(model: ModelStatic<Model>, alias: string, exclude: readonly string[] = []): string {
  return Object.entries(model.getAttributes())
    .filter(([name]) => !exclude.includes(name))
    .map(([name, a]) => `${alias}.\`${a.field ?? name}\` AS \`${name}\``)
    .join(', ');
}

/** A row read with `columnsOf`, as the model instance a `findAll` would have built from it. */
export function instanceOf<M extends Model>(model: ModelStatic<M>, row: Record<string, unknown>): M {
  return model.build(row as never, { raw: true, isNewRecord: false });
}

/**
 * The SELECT a `findAll` with these options would send, attribute names mapped to columns and the rows' keys to
 * attribute names, for a hot read to send plain (its `where` may come from an ability, `accessibleWhere`).
 */
export function selectSql(model: ModelStatic<Model>, options: FindOptions): string {
  type Generator = { selectQuery(table: string, options: object, model: unknown): string };
  const generator = model.sequelize!.getQueryInterface().queryGenerator as Generator;
  const mapped = (Utils as unknown as { mapOptionFieldNames<T>(o: T, m: unknown): T }).mapOptionFieldNames(
    { ...options },
    model,
  );
  return generator.selectQuery(model.getTableName() as string, mapped, model);
}
