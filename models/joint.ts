import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Joint extends Model<InferAttributes<Joint>, InferCreationAttributes<Joint>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare nominalSize: string;
  declare pressureClass: string;
  declare studCount: number;
  declare threadSystem: 'inch' | 'metric';
  /** inch: nominal diameter in inches; metric: millimetres. */
  declare threadDiameter: number;
  /** inch: threads per inch; metric: pitch in millimetres. */
  declare threadPitch: number;
  declare studGrade: string;
  declare nutGrade: CreationOptional<string | null>;
  declare washer: CreationOptional<string | null>;
  declare gasketType: string;
  declare targetLoadN: number;
  declare bandPercent: CreationOptional<number>;
  declare notes: CreationOptional<string | null>;
  /** Gasket contact diameters, mm (or the contact area, mm², when the diameters are not known). */
  declare gasketInnerMm: CreationOptional<number | null>;
  declare gasketOuterMm: CreationOptional<number | null>;
  declare gasketAreaMm2: CreationOptional<number | null>;
  /** The gasket's minimum seating and maximum stress, MPa, with the source the centre gives for them. */
  declare gasketMinSeatingMpa: CreationOptional<number | null>;
  declare gasketMaxMpa: CreationOptional<number | null>;
  declare gasketStressSource: CreationOptional<string | null>;
  declare flangeFacing: CreationOptional<string | null>;
  declare clampLengthMm: CreationOptional<number | null>;
  /** Live capture's logger line (lib/ingest/logger-line.ts): serial speed and line format. */
  declare serialBaudRate: CreationOptional<number>;
  declare lineDelimiter: CreationOptional<string>;
  declare lineDecimalComma: CreationOptional<boolean>;
  declare lineTimeField: CreationOptional<number>;
  /** Comma-separated 1-based field numbers of channels 1, 2, …; null = every other field in order. */
  declare lineChannelFields: CreationOptional<string | null>;
  declare lineLoadUnit: CreationOptional<string>;
  /** Optimistic-lock version: raised by one on every edit (lib/data/optimistic-lock.ts). */
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Joint.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        nominalSize: { type: DataTypes.STRING(40), allowNull: false },
        pressureClass: { type: DataTypes.STRING(40), allowNull: false },
        studCount: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        threadSystem: { type: DataTypes.ENUM('inch', 'metric'), allowNull: false },
        threadDiameter: { type: DataTypes.DOUBLE, allowNull: false },
        threadPitch: { type: DataTypes.DOUBLE, allowNull: false },
        studGrade: { type: DataTypes.STRING(80), allowNull: false },
        nutGrade: { type: DataTypes.STRING(80), allowNull: true },
        washer: { type: DataTypes.STRING(120), allowNull: true },
        gasketType: { type: DataTypes.STRING(160), allowNull: false },
        targetLoadN: { type: DataTypes.DOUBLE, allowNull: false },
        bandPercent: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 10 },
        notes: { type: DataTypes.TEXT, allowNull: true },
        gasketInnerMm: { type: DataTypes.DOUBLE, allowNull: true },
        gasketOuterMm: { type: DataTypes.DOUBLE, allowNull: true },
        gasketAreaMm2: { type: DataTypes.DOUBLE, allowNull: true, field: 'gasket_area_mm2' },
        gasketMinSeatingMpa: { type: DataTypes.DOUBLE, allowNull: true },
        gasketMaxMpa: { type: DataTypes.DOUBLE, allowNull: true },
        gasketStressSource: { type: DataTypes.STRING(200), allowNull: true },
        flangeFacing: { type: DataTypes.STRING(40), allowNull: true },
        clampLengthMm: { type: DataTypes.DOUBLE, allowNull: true },
        serialBaudRate: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 9600 },
        lineDelimiter: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'comma' },
        lineDecimalComma: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        lineTimeField: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 },
        lineChannelFields: { type: DataTypes.STRING(2000), allowNull: true },
        lineLoadUnit: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'kN' },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'joints', underscored: true },
    );
  }
}
