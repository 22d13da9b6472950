import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import { studioRoles, type StudioRole } from '../../shared/api/auth';

export interface InvitationAttributes {
  id: number;
  studioId: number;
  invitedById: number;
  email: string;
  role: StudioRole;
  /** SHA-256 of the token in the mailed link. */
  tokenHash: string;
  expiresAt: Date;
  acceptedAt: Date | null;
  acceptedById: number | null;
  createdAt: Date;
}
export type InvitationCreation = Optional<InvitationAttributes, 'id' | 'acceptedAt' | 'acceptedById' | 'createdAt'>;
export interface InvitationRow extends Model<InvitationAttributes, InvitationCreation>, InvitationAttributes {}
export type InvitationModel = ModelStatic<InvitationRow>;

/** A single-use, time-limited invitation to join a studio in a role. */
export function defineInvitation(sequelize: Sequelize): InvitationModel {
  return sequelize.define<InvitationRow>('Invitation', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    studioId: { type: DataTypes.INTEGER, allowNull: false },
    invitedById: { type: DataTypes.INTEGER, allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM(...studioRoles), allowNull: false },
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    acceptedAt: { type: DataTypes.DATE, allowNull: true },
    acceptedById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
  }, { tableName: 'invitations', updatedAt: false });
}
