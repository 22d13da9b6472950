import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface StudioAttributes {
  id: number;
  name: string;
  createdAt: Date;
  updatedAt: Date;
}
export type StudioCreation = Optional<StudioAttributes, 'id' | 'createdAt' | 'updatedAt'>;
export interface StudioRow extends Model<StudioAttributes, StudioCreation>, StudioAttributes {}
export type StudioModel = ModelStatic<StudioRow>;

/** A group of weavers (a class, a guild) sharing drafts. */
export function defineStudio(sequelize: Sequelize): StudioModel {
  return sequelize.define<StudioRow>('Studio', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(100), allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'studios' });
}
