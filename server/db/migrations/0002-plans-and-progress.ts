import { DataTypes, type QueryInterface } from 'sequelize';

// A frozen snapshot like 0001: columns spelled out, no model imports.
const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true, allowNull: false };
const ref = (table: string) => ({
  type: DataTypes.INTEGER,
  allowNull: false,
  references: { model: table, key: 'id' },
  onDelete: 'CASCADE',
  onUpdate: 'CASCADE',
});
const options = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const size = () => ({ type: DataTypes.DOUBLE, allowNull: false });

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('draft_plans', {
    id,
    draftId: { ...ref('drafts'), unique: true },
    document: { type: DataTypes.JSON, allowNull: false },
    updatedById: ref('users'),
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  }, options);

  await qi.createTable('loom_progress', {
    id,
    userId: ref('users'),
    draftId: ref('drafts'),
    list: { type: DataTypes.STRING(20), allowNull: false },
    positions: { type: DataTypes.JSON, allowNull: false },
    settings: { type: DataTypes.JSON, allowNull: false },
    movedAt: { type: DataTypes.DATE(3), allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  }, options);
  await qi.addIndex('loom_progress', ['userId', 'draftId'], { unique: true, name: 'loom_progress_user_draft' });

  await qi.createTable('weaving_results', {
    id,
    userId: ref('users'),
    draftId: ref('drafts'),
    unit: { type: DataTypes.STRING(4), allowNull: false },
    widthInReed: size(),
    lengthOnLoom: size(),
    widthOffLoom: size(),
    lengthOffLoom: size(),
    widthFinished: { type: DataTypes.DOUBLE, allowNull: true },
    lengthFinished: { type: DataTypes.DOUBLE, allowNull: true },
    warpYarn: { type: DataTypes.STRING(100), allowNull: true },
    weftYarn: { type: DataTypes.STRING(100), allowNull: true },
    yarnKey: { type: DataTypes.STRING(210), allowNull: false },
    allowances: { type: DataTypes.JSON, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  }, options);
  await qi.addIndex('weaving_results', ['draftId', 'createdAt'], { name: 'weaving_results_draft' });
  await qi.addIndex('weaving_results', ['userId', 'yarnKey'], { name: 'weaving_results_user_yarns' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('weaving_results');
  await qi.dropTable('loom_progress');
  await qi.dropTable('draft_plans');
}
