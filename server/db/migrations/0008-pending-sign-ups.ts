import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Sign-ups waiting for their mailed link: the account is made only when the link is opened, so a
 * sign-up answers the same for a taken address as for a new one. Only the token's hash is stored.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('pending_sign_ups', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true, allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(100), allowNull: false },
    passwordHash: { type: DataTypes.STRING(200), allowNull: false },
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  }, { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' });
  await qi.addIndex('pending_sign_ups', ['email'], { name: 'pending_sign_ups_email' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('pending_sign_ups');
}
