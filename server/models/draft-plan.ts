import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { UserRow } from './user';

export interface DraftPlanAttributes {
  id: number;
  draftId: number;
  /** The plan document (shared/plan PlanDocument), checked by its schema before it is stored. */
  document: unknown;
  updatedById: number;
  createdAt: Date;
  updatedAt: Date;
}
export type DraftPlanCreation = Optional<DraftPlanAttributes, 'id' | 'createdAt' | 'updatedAt'>;
export interface DraftPlanRow extends Model<DraftPlanAttributes, DraftPlanCreation>, DraftPlanAttributes {
  updatedBy?: UserRow;
}
export type DraftPlanModel = ModelStatic<DraftPlanRow>;

/** The warp plan saved with a draft: one per draft, shared by everyone who can see the draft. */
export function defineDraftPlan(sequelize: Sequelize): DraftPlanModel {
  return sequelize.define<DraftPlanRow>('DraftPlan', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    draftId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
    document: { type: DataTypes.JSON, allowNull: false },
    updatedById: { type: DataTypes.INTEGER, allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'draft_plans' });
}
