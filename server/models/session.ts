import { DataTypes, type Model, type ModelStatic, type Sequelize } from 'sequelize';

export interface SessionAttributes {
  sid: string;
  expires: Date | null;
  data: string;
  createdAt: Date;
  updatedAt: Date;
}
export interface SessionRow extends Model<SessionAttributes>, SessionAttributes {}
export type SessionModel = ModelStatic<SessionRow>;

/** The table connect-session-sequelize reads and writes (its columns, our migration). */
export function defineSession(sequelize: Sequelize): SessionModel {
  return sequelize.define<SessionRow>('Session', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    expires: DataTypes.DATE,
    data: DataTypes.TEXT,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  }, { tableName: 'sessions' });
}
