import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface PasswordResetAttributes {
  id: number;
  userId: number;
  /** SHA-256 of the token in the mailed link; the token itself is never stored. */
  tokenHash: string;
  expiresAt: Date;
  usedAt: Date | null;
  createdAt: Date;
}
export type PasswordResetCreation = Optional<PasswordResetAttributes, 'id' | 'usedAt' | 'createdAt'>;
export interface PasswordResetRow extends Model<PasswordResetAttributes, PasswordResetCreation>, PasswordResetAttributes {}
export type PasswordResetModel = ModelStatic<PasswordResetRow>;

/** A single-use, time-limited permission to set a new password. */
export function definePasswordReset(sequelize: Sequelize): PasswordResetModel {
  return sequelize.define<PasswordResetRow>('PasswordReset', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
  }, { tableName: 'password_resets', updatedAt: false });
}
