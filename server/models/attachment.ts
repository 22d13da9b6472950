import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { UserRow } from './user';

export interface AttachmentAttributes {
  id: number;
  draftId: number;
  version: number;
  uploaderId: number;
  /** Where the bytes live in the attachment storage (never a path the web server serves). */
  storageKey: string;
  contentType: string;
  bytes: number;
  createdAt: Date;
}
export type AttachmentCreation = Optional<AttachmentAttributes, 'id' | 'createdAt'>;
export interface AttachmentRow extends Model<AttachmentAttributes, AttachmentCreation>, AttachmentAttributes {
  /** Present when included in the query. */
  uploader?: UserRow;
}
export type AttachmentModel = ModelStatic<AttachmentRow>;

/** A photo of the woven cloth, attached to one version of a draft. */
export function defineAttachment(sequelize: Sequelize): AttachmentModel {
  return sequelize.define<AttachmentRow>('Attachment', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    draftId: { type: DataTypes.INTEGER, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false },
    uploaderId: { type: DataTypes.INTEGER, allowNull: false },
    storageKey: { type: DataTypes.STRING(200), allowNull: false },
    contentType: { type: DataTypes.STRING(50), allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    createdAt: DataTypes.DATE,
  }, { tableName: 'attachments', updatedAt: false });
}
