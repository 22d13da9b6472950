import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { StudioRow } from './studio';
import type { UserRow } from './user';

export interface DraftAttributes {
  id: number;
  /**
   * Who made the draft. A personal draft is theirs; a studio draft is the studio's, and this only
   * names its author (the studio role decides what anyone may do with it).
   */
  ownerId: number;
  /** null for a personal draft. */
  studioId: number | null;
  name: string;
  /** The draft document (shared/weave Draft), checked by the engine's parser before it is stored. */
  document: unknown;
  // Computed from the document when it is saved, so the library can filter and sort without parsing it.
  ends: number;
  picks: number;
  shafts: number;
  colors: number;
  tags: string[];
  /** Structures found in the document when it was saved (see services/draft-stats). */
  structure: string[];
  /** The draft this one was forked from, and from which of its versions. */
  parentDraftId: number | null;
  parentVersion: number | null;
  /** PNG of the start of the cloth; a save clears it and the first request for it renders it (services/draft-thumbnails). */
  thumbnail: Buffer | null;
  /** Number of the newest DraftVersion. */
  version: number;
  /** When the draft was put in the Bin; null while it is in use. */
  binnedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}
export type DraftCreation = Optional<
  DraftAttributes,
  'id' | 'studioId' | 'tags' | 'structure' | 'parentDraftId' | 'parentVersion' | 'thumbnail' | 'version' | 'binnedAt' | 'createdAt' | 'updatedAt'
>;
export interface DraftRow extends Model<DraftAttributes, DraftCreation>, DraftAttributes {
  /** Present when included in the query. */
  owner?: UserRow;
  studio?: StudioRow | null;
}
export type DraftModel = ModelStatic<DraftRow>;

/** The current state of a draft; its history lives in DraftVersion. */
export function defineDraft(sequelize: Sequelize): DraftModel {
  return sequelize.define<DraftRow>('Draft', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    ownerId: { type: DataTypes.INTEGER, allowNull: false },
    studioId: { type: DataTypes.INTEGER, allowNull: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    document: { type: DataTypes.JSON, allowNull: false },
    ends: { type: DataTypes.INTEGER, allowNull: false },
    picks: { type: DataTypes.INTEGER, allowNull: false },
    shafts: { type: DataTypes.INTEGER, allowNull: false },
    colors: { type: DataTypes.INTEGER, allowNull: false },
    tags: { type: DataTypes.JSON, allowNull: false, defaultValue: [] },
    structure: { type: DataTypes.JSON, allowNull: false, defaultValue: [] },
    parentDraftId: { type: DataTypes.INTEGER, allowNull: true },
    parentVersion: { type: DataTypes.INTEGER, allowNull: true },
    thumbnail: { type: DataTypes.BLOB('medium'), allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    binnedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'drafts' });
}
