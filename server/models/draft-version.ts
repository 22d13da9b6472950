import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface DraftVersionAttributes {
  id: number;
  draftId: number;
  version: number;
  authorId: number;
  message: string;
  document: unknown;
  createdAt: Date;
}
export type DraftVersionCreation = Optional<DraftVersionAttributes, 'id' | 'message' | 'createdAt'>;
export interface DraftVersionRow extends Model<DraftVersionAttributes, DraftVersionCreation>, DraftVersionAttributes {}
export type DraftVersionModel = ModelStatic<DraftVersionRow>;

/** One saved state of a draft; versions are never changed once written. */
export function defineDraftVersion(sequelize: Sequelize): DraftVersionModel {
  return sequelize.define<DraftVersionRow>('DraftVersion', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    draftId: { type: DataTypes.INTEGER, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false },
    authorId: { type: DataTypes.INTEGER, allowNull: false },
    message: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    document: { type: DataTypes.JSON, allowNull: false },
    createdAt: DataTypes.DATE,
  }, { tableName: 'draft_versions', updatedAt: false });
}
