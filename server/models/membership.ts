import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import { studioRoles, type StudioRole } from '../../shared/api/auth';
import type { StudioRow } from './studio';
import type { UserRow } from './user';

export interface MembershipAttributes {
  id: number;
  studioId: number;
  userId: number;
  role: StudioRole;
  createdAt: Date;
  updatedAt: Date;
}
export type MembershipCreation = Optional<MembershipAttributes, 'id' | 'createdAt' | 'updatedAt'>;
export interface MembershipRow extends Model<MembershipAttributes, MembershipCreation>, MembershipAttributes {
  /** Present when included in the query. */
  studio?: StudioRow;
  user?: UserRow;
}
export type MembershipModel = ModelStatic<MembershipRow>;

/** A user's role in one studio. */
export function defineMembership(sequelize: Sequelize): MembershipModel {
  return sequelize.define<MembershipRow>('Membership', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    studioId: { type: DataTypes.INTEGER, allowNull: false },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    role: { type: DataTypes.ENUM(...studioRoles), allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'memberships' });
}
