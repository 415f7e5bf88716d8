import {
  Model,
  DataTypes,
  type Sequelize,
  type InferAttributes,
  type InferCreationAttributes,
  type CreationOptional,
} from 'sequelize';

export class Calc extends Model<InferAttributes<Calc>, InferCreationAttributes<Calc>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare number: string;
  declare title: string;
  declare partRef: CreationOptional<string>;
  declare createdBy: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Calc.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        projectId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        number: { type: DataTypes.STRING(40), allowNull: false },
        title: { type: DataTypes.STRING(200), allowNull: false },
        partRef: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
        createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'calcs', underscored: true },
    );
  }
}

export class CalcEditor extends Model<InferAttributes<CalcEditor>, InferCreationAttributes<CalcEditor>> {
  declare calcId: number;
  declare userId: number;
  declare firstEditAt: Date;

  static initModel(sequelize: Sequelize): void {
    CalcEditor.init(
      {
        calcId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        firstEditAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'calc_editors', underscored: true, timestamps: false },
    );
  }
}
