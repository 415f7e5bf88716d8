import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

/** A checker's finding on a revision (or one checklist row), and the author's answer to it. */
export class Finding extends Model<InferAttributes<Finding>, InferCreationAttributes<Finding>> {
  declare id: CreationOptional<number>;
  declare revisionId: number;
  declare clauseRef: string | null;
  /** The row's location with a clause (`segments[1]`), or a named input without one (`segments[1].od`). */
  declare anchorPath: CreationOptional<string | null>;
  declare text: string;
  declare status: CreationOptional<'open' | 'answered' | 'closed'>;
  declare raisedBy: number;
  declare answer: CreationOptional<string | null>;
  declare answeredBy: CreationOptional<number | null>;
  declare answeredAt: CreationOptional<Date | null>;
  declare closedBy: CreationOptional<number | null>;
  declare closedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    // Fresh objects per attribute: Sequelize writes the column name into each definition, so a shared one maps two
    // attributes to one column.
    const user = () => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
    const when = () => ({ type: DataTypes.DATE(3), allowNull: true });
    Finding.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        clauseRef: { type: DataTypes.STRING(120), allowNull: true },
        anchorPath: { type: DataTypes.STRING(200), allowNull: true },
        text: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.ENUM('open', 'answered', 'closed'), allowNull: false, defaultValue: 'open' },
        raisedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        answer: { type: DataTypes.TEXT, allowNull: true },
        answeredBy: user(),
        answeredAt: when(),
        closedBy: user(),
        closedAt: when(),
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'findings', underscored: true },
    );
  }
}
