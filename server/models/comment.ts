import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { UserRow } from './user';

export interface CommentAttributes {
  id: number;
  draftId: number;
  authorId: number;
  /** The version the comment is about, or null for the draft as a whole. */
  version: number | null;
  /** 1-based end and pick the comment points at, if any. */
  endNumber: number | null;
  pickNumber: number | null;
  text: string;
  createdAt: Date;
}
export type CommentCreation = Optional<CommentAttributes, 'id' | 'version' | 'endNumber' | 'pickNumber' | 'createdAt'>;
export interface CommentRow extends Model<CommentAttributes, CommentCreation>, CommentAttributes {
  /** Present when included in the query. */
  author?: UserRow;
}
export type CommentModel = ModelStatic<CommentRow>;

/** A question or note on a draft by anyone who can see it. */
export function defineComment(sequelize: Sequelize): CommentModel {
  return sequelize.define<CommentRow>('Comment', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    draftId: { type: DataTypes.INTEGER, allowNull: false },
    authorId: { type: DataTypes.INTEGER, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: true },
    endNumber: { type: DataTypes.INTEGER, allowNull: true },
    pickNumber: { type: DataTypes.INTEGER, allowNull: true },
    text: { type: DataTypes.TEXT, allowNull: false },
    createdAt: DataTypes.DATE,
  }, { tableName: 'comments', updatedAt: false });
}
