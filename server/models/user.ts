import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface UserAttributes {
  id: number;
  email: string;
  name: string;
  passwordHash: string;
  isAdmin: boolean;
  createdAt: Date;
  updatedAt: Date;
}
export type UserCreation = Optional<UserAttributes, 'id' | 'isAdmin' | 'createdAt' | 'updatedAt'>;
export interface UserRow extends Model<UserAttributes, UserCreation>, UserAttributes {}
export type UserModel = ModelStatic<UserRow>;

/** An account; the password is only ever held as an argon2 hash. */
export function defineUser(sequelize: Sequelize): UserModel {
  return sequelize.define<UserRow>('User', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(100), allowNull: false },
    passwordHash: { type: DataTypes.STRING(200), allowNull: false },
    isAdmin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'users' });
}
