import type { QueryInterface } from 'sequelize';

// The library sorts by name as well as by last change: with these the first page by name is read in
// index order, as it already is by last change (drafts_owner_updated, drafts_studio_updated), instead
// of sorting every draft the weaver can see.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addIndex('drafts', ['ownerId', 'name'], { name: 'drafts_owner_name' });
  await qi.addIndex('drafts', ['studioId', 'name'], { name: 'drafts_studio_name' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeIndex('drafts', 'drafts_studio_name');
  await qi.removeIndex('drafts', 'drafts_owner_name');
}
