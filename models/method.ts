import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const TOOL_KINDS = ['manual_torque_wrench', 'hydraulic_torque_wrench', 'hydraulic_tensioner', 'other'] as const;
export type ToolKind = (typeof TOOL_KINDS)[number];
/** How many studs the method's tool set pulls at once (lib/calc/tensioner-coverage.ts); torque methods are `one_stud`. */
export const TENSIONER_COVERAGES = ['every_stud', 'every_second_stud', 'one_stud'] as const;
export type TensionerCoverage = (typeof TENSIONER_COVERAGES)[number];
/**
 * One pass of a method: a % of the target load and the stud order. Cross and circular orders are
 * generated per stud count; a custom order is given explicitly. `orderByStudCount` holds the order
 * for each stud count the method is used with (key = stud count as a string).
 */
export interface MethodPass {
  percentOfTarget: number;
  pattern: 'cross' | 'circular' | 'custom';
  orderByStudCount: Record<string, number[]>;
}

export class Method extends Model<InferAttributes<Method>, InferCreationAttributes<Method>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare toolKind: ToolKind;
  declare passes: MethodPass[];
  declare checkPasses: CreationOptional<number>;
  declare tensionerCoverage: CreationOptional<TensionerCoverage>;
  declare notes: CreationOptional<string | null>;
  /** Optimistic-lock version: raised by one on every edit (lib/data/optimistic-lock.ts). */
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Method.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false, unique: true },
        toolKind: { type: DataTypes.ENUM(...TOOL_KINDS), allowNull: false },
        passes: {
          type: DataTypes.JSON,
          allowNull: false,
          // MariaDB stores JSON as LONGTEXT: parse on read.
          get() {
            const raw = this.getDataValue('passes') as unknown;
            return (typeof raw === 'string' ? JSON.parse(raw) : raw) as MethodPass[];
          },
        },
        checkPasses: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        tensionerCoverage: { type: DataTypes.ENUM(...TENSIONER_COVERAGES), allowNull: false, defaultValue: 'one_stud' },
        notes: { type: DataTypes.TEXT, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'methods', underscored: true },
    );
  }
}
