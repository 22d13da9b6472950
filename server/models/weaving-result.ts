import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { Allowances } from '../../shared/plan/warp';
import type { UserRow } from './user';

export interface WeavingResultAttributes {
  id: number;
  userId: number;
  draftId: number;
  unit: 'inch' | 'cm';
  widthInReed: number;
  lengthOnLoom: number;
  widthOffLoom: number;
  lengthOffLoom: number;
  widthFinished: number | null;
  lengthFinished: number | null;
  warpYarn: string | null;
  weftYarn: string | null;
  /** yarnPairKey of the two yarns, to average results woven with the same yarns. */
  yarnKey: string;
  /** Measured take-up, draw-in and shrinkage, computed from the sizes when saved. */
  allowances: Partial<Allowances>;
  notes: string;
  createdAt: Date;
}
export type WeavingResultCreation = Optional<WeavingResultAttributes, 'id' | 'createdAt'>;
export interface WeavingResultRow extends Model<WeavingResultAttributes, WeavingResultCreation>, WeavingResultAttributes {
  weaver?: UserRow;
}
export type WeavingResultModel = ModelStatic<WeavingResultRow>;

/** What one weaver measured of a cloth woven from a draft; never changed once written. */
export function defineWeavingResult(sequelize: Sequelize): WeavingResultModel {
  // NOTE: a function, not one shared object: Sequelize writes each column's name into its definition.
  const size = () => ({ type: DataTypes.DOUBLE, allowNull: false });
  return sequelize.define<WeavingResultRow>('WeavingResult', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    draftId: { type: DataTypes.INTEGER, allowNull: false },
    unit: { type: DataTypes.STRING(4), allowNull: false },
    widthInReed: size(),
    lengthOnLoom: size(),
    widthOffLoom: size(),
    lengthOffLoom: size(),
    widthFinished: { type: DataTypes.DOUBLE, allowNull: true },
    lengthFinished: { type: DataTypes.DOUBLE, allowNull: true },
    warpYarn: { type: DataTypes.STRING(100), allowNull: true },
    weftYarn: { type: DataTypes.STRING(100), allowNull: true },
    yarnKey: { type: DataTypes.STRING(210), allowNull: false },
    allowances: { type: DataTypes.JSON, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false },
    createdAt: DataTypes.DATE,
  }, { tableName: 'weaving_results', updatedAt: false });
}
