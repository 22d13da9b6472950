import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface DraftVersionAttributes {
  id: number;
  draftId: number;
  /** The number of the newest save this row holds; a working version's number moves up with each save of its sitting. */
  version: number;
  /** The number of the sitting's first save: the row stands for every save from here to `version`. */
  firstVersion: number;
  /** Saved with "Save version" (or made by create, import, fork, restore); never continued by an autosave. */
  named: boolean;
  authorId: number;
  message: string;
  document: unknown;
  createdAt: Date;
  /** When the newest save in the row was made. */
  savedAt: Date;
}
export type DraftVersionCreation = Optional<DraftVersionAttributes, 'id' | 'message' | 'createdAt' | 'named' | 'savedAt'>;
export interface DraftVersionRow extends Model<DraftVersionAttributes, DraftVersionCreation>, DraftVersionAttributes {
  /** Present when included in the query. */
  author?: { name: string } | null;
}
export type DraftVersionModel = ModelStatic<DraftVersionRow>;

/**
 * One version in a draft's history: a named version, never changed once written, or the working
 * version of an editing sitting, which the same weaver's autosaves carry forward (services/draft-versions).
 */
export function defineDraftVersion(sequelize: Sequelize): DraftVersionModel {
  return sequelize.define<DraftVersionRow>('DraftVersion', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    draftId: { type: DataTypes.INTEGER, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false },
    firstVersion: { type: DataTypes.INTEGER, allowNull: false },
    named: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    authorId: { type: DataTypes.INTEGER, allowNull: false },
    message: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    document: { type: DataTypes.JSON, allowNull: false },
    createdAt: DataTypes.DATE,
    savedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  }, { tableName: 'draft_versions', updatedAt: false });
}
