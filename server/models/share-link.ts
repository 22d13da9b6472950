import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface ShareLinkAttributes {
  id: number;
  draftId: number;
  createdById: number;
  /** SHA-256 of the token in the link; the token itself is never stored. */
  tokenHash: string;
  revokedAt: Date | null;
  createdAt: Date;
}
export type ShareLinkCreation = Optional<ShareLinkAttributes, 'id' | 'revokedAt' | 'createdAt'>;
export interface ShareLinkRow extends Model<ShareLinkAttributes, ShareLinkCreation>, ShareLinkAttributes {}
export type ShareLinkModel = ModelStatic<ShareLinkRow>;

/** A public read-only link to a draft, valid until revoked. */
export function defineShareLink(sequelize: Sequelize): ShareLinkModel {
  return sequelize.define<ShareLinkRow>('ShareLink', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    draftId: { type: DataTypes.INTEGER, allowNull: false },
    createdById: { type: DataTypes.INTEGER, allowNull: false },
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
  }, { tableName: 'share_links', updatedAt: false });
}
