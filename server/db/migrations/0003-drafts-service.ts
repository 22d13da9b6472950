import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

// A frozen snapshot like 0001: columns spelled out here, never imported from the models.
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true, allowNull: false };
const createdAt = { type: DataTypes.DATE, allowNull: false };
const ref = (table: string, onDelete: 'CASCADE' | 'SET NULL', allowNull = false) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const options = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('drafts', 'parentDraftId', ref('drafts', 'SET NULL', true));
  await qi.addColumn('drafts', 'parentVersion', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('drafts', 'structure', { type: DataTypes.JSON, allowNull: true });
  // A small PNG of the cloth; kept out of list queries by naming the columns they read.
  await qi.addColumn('drafts', 'thumbnail', { type: DataTypes.BLOB('medium'), allowNull: true });
  await qi.sequelize.query("UPDATE drafts SET structure = '[]' WHERE structure IS NULL", { type: QueryTypes.UPDATE });
  await qi.addIndex('drafts', ['parentDraftId'], { name: 'drafts_parent' });

  await qi.createTable('yarns', {
    id,
    ownerId: ref('users', 'CASCADE'),
    name: { type: DataTypes.STRING(100), allowNull: false },
    fibre: { type: DataTypes.STRING(100), allowNull: false, defaultValue: '' },
    colour: { type: DataTypes.CHAR(7), allowNull: false },
    count: { type: DataTypes.STRING(50), allowNull: false, defaultValue: '' },
    yardsPerPound: { type: DataTypes.DOUBLE, allowNull: true },
    createdAt,
    updatedAt: createdAt,
  }, options);
  await qi.addIndex('yarns', ['ownerId', 'name'], { name: 'yarns_owner_name' });

  await qi.createTable('comments', {
    id,
    draftId: ref('drafts', 'CASCADE'),
    authorId: ref('users', 'CASCADE'),
    version: { type: DataTypes.INTEGER, allowNull: true },
    endNumber: { type: DataTypes.INTEGER, allowNull: true },
    pickNumber: { type: DataTypes.INTEGER, allowNull: true },
    text: { type: DataTypes.TEXT, allowNull: false },
    createdAt,
  }, options);
  await qi.addIndex('comments', ['draftId', 'createdAt'], { name: 'comments_draft_created' });

  await qi.createTable('share_links', {
    id,
    draftId: ref('drafts', 'CASCADE'),
    createdById: ref('users', 'CASCADE'),
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt,
  }, options);
  await qi.addIndex('share_links', ['draftId'], { name: 'share_links_draft' });

  await qi.createTable('invitations', {
    id,
    studioId: ref('studios', 'CASCADE'),
    invitedById: ref('users', 'CASCADE'),
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM('viewer', 'editor', 'owner'), allowNull: false },
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    acceptedAt: { type: DataTypes.DATE, allowNull: true },
    acceptedById: ref('users', 'SET NULL', true),
    createdAt,
  }, options);

  await qi.createTable('attachments', {
    id,
    draftId: ref('drafts', 'CASCADE'),
    version: { type: DataTypes.INTEGER, allowNull: false },
    uploaderId: ref('users', 'CASCADE'),
    storageKey: { type: DataTypes.STRING(200), allowNull: false },
    contentType: { type: DataTypes.STRING(50), allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    createdAt,
  }, options);
  await qi.addIndex('attachments', ['draftId', 'version'], { name: 'attachments_draft_version' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const table of ['attachments', 'invitations', 'share_links', 'comments', 'yarns']) await qi.dropTable(table);
  await qi.removeIndex('drafts', 'drafts_parent');
  for (const column of ['thumbnail', 'structure', 'parentVersion', 'parentDraftId']) await qi.removeColumn('drafts', column);
}
