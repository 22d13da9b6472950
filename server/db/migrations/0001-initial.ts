import { DataTypes, type QueryInterface } from 'sequelize';

// A migration is a frozen snapshot: it spells out its columns instead of importing the models,
// so later model changes never rewrite history.
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true, allowNull: false };
const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const ref = (table: string, onDelete: 'CASCADE' | 'SET NULL' | 'RESTRICT', allowNull = false) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const options = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('users', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(100), allowNull: false },
    passwordHash: { type: DataTypes.STRING(200), allowNull: false },
    isAdmin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    ...timestamps,
  }, options);

  await qi.createTable('studios', {
    id,
    name: { type: DataTypes.STRING(100), allowNull: false },
    ...timestamps,
  }, options);

  await qi.createTable('memberships', {
    id,
    studioId: ref('studios', 'CASCADE'),
    userId: ref('users', 'CASCADE'),
    role: { type: DataTypes.ENUM('viewer', 'editor', 'owner'), allowNull: false },
    ...timestamps,
  }, options);
  await qi.addIndex('memberships', ['studioId', 'userId'], { unique: true, name: 'memberships_studio_user' });

  await qi.createTable('drafts', {
    id,
    ownerId: ref('users', 'CASCADE'),
    studioId: ref('studios', 'SET NULL', true),
    name: { type: DataTypes.STRING(200), allowNull: false },
    document: { type: DataTypes.JSON, allowNull: false },
    ends: { type: DataTypes.INTEGER, allowNull: false },
    picks: { type: DataTypes.INTEGER, allowNull: false },
    shafts: { type: DataTypes.INTEGER, allowNull: false },
    colors: { type: DataTypes.INTEGER, allowNull: false },
    tags: { type: DataTypes.JSON, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    ...timestamps,
  }, options);
  await qi.addIndex('drafts', ['ownerId', 'updatedAt'], { name: 'drafts_owner_updated' });
  await qi.addIndex('drafts', ['studioId', 'updatedAt'], { name: 'drafts_studio_updated' });

  await qi.createTable('draft_versions', {
    id,
    draftId: ref('drafts', 'CASCADE'),
    version: { type: DataTypes.INTEGER, allowNull: false },
    authorId: ref('users', 'CASCADE'),
    message: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    document: { type: DataTypes.JSON, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  }, options);
  await qi.addIndex('draft_versions', ['draftId', 'version'], { unique: true, name: 'draft_versions_draft_version' });

  await qi.createTable('password_resets', {
    id,
    userId: ref('users', 'CASCADE'),
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  }, options);

  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true, allowNull: false },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  }, options);
  await qi.addIndex('sessions', ['expires'], { name: 'sessions_expires' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const table of ['sessions', 'password_resets', 'draft_versions', 'drafts', 'memberships', 'studios', 'users']) {
    await qi.dropTable(table);
  }
}
