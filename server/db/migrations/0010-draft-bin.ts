import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The Bin: a deleted draft is kept, with when it was put in the Bin, for BIN_DAYS; until then its
 * owner can restore it, and nobody else finds it.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('drafts', 'binnedAt', { type: DataTypes.DATE, allowNull: true });
  await qi.addIndex('drafts', ['binnedAt'], { name: 'drafts_binned_at' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeIndex('drafts', 'drafts_binned_at');
  await qi.removeColumn('drafts', 'binnedAt');
}
