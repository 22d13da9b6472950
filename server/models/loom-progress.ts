import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { LoomList, WorkingOrder } from '../../shared/api/plans';

export interface LoomProgressAttributes {
  id: number;
  userId: number;
  draftId: number;
  /** The list the weaver was last on. */
  list: LoomList;
  positions: Partial<Record<LoomList, number>>;
  settings: WorkingOrder;
  /** When the weaver last moved the marker, by their device's clock. */
  movedAt: Date;
  createdAt: Date;
  updatedAt: Date;
}
export type LoomProgressCreation = Optional<LoomProgressAttributes, 'id' | 'createdAt' | 'updatedAt'>;
export interface LoomProgressRow extends Model<LoomProgressAttributes, LoomProgressCreation>, LoomProgressAttributes {}
export type LoomProgressModel = ModelStatic<LoomProgressRow>;

/** Where one weaver is in the loom-side lists of one draft. */
export function defineLoomProgress(sequelize: Sequelize): LoomProgressModel {
  return sequelize.define<LoomProgressRow>('LoomProgress', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    draftId: { type: DataTypes.INTEGER, allowNull: false },
    list: { type: DataTypes.STRING(20), allowNull: false },
    positions: { type: DataTypes.JSON, allowNull: false },
    settings: { type: DataTypes.JSON, allowNull: false },
    movedAt: { type: DataTypes.DATE(3), allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'loom_progress' });
}
