import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface PendingSignUpAttributes {
  id: number;
  email: string;
  name: string;
  passwordHash: string;
  /** SHA-256 of the token in the mailed link; the token itself is never stored. */
  tokenHash: string;
  expiresAt: Date;
  usedAt: Date | null;
  createdAt: Date;
}
export type PendingSignUpCreation = Optional<PendingSignUpAttributes, 'id' | 'usedAt' | 'createdAt'>;
export interface PendingSignUpRow extends Model<PendingSignUpAttributes, PendingSignUpCreation>, PendingSignUpAttributes {}
export type PendingSignUpModel = ModelStatic<PendingSignUpRow>;

/** A sign-up whose account is made when the link mailed to its address is opened (once, within a day). */
export function definePendingSignUp(sequelize: Sequelize): PendingSignUpModel {
  return sequelize.define<PendingSignUpRow>('PendingSignUp', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(100), allowNull: false },
    passwordHash: { type: DataTypes.STRING(200), allowNull: false },
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
  }, { tableName: 'pending_sign_ups', updatedAt: false });
}
