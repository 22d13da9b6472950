import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

/**
 * Working versions: an autosave continues its sitting's version instead of adding one per pause.
 * A version row now covers the save numbers `firstVersion` to `version` (one number per save, so the
 * draft's version stays the token every save is checked against); `named` marks a version the weaver
 * saved with "Save version" (or made by creating, importing, forking or restoring), which a later
 * autosave never continues; `savedAt` is the time of the row's last save, `createdAt` its first.
 * Rows stored before this were each one save: those with a message are named, the rest working.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('draft_versions', 'named', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true });
  await qi.addColumn('draft_versions', 'firstVersion', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('draft_versions', 'savedAt', { type: DataTypes.DATE, allowNull: true });
  await qi.sequelize.query(
    "UPDATE draft_versions SET firstVersion = version, savedAt = createdAt, named = (message <> '')",
    { type: QueryTypes.UPDATE },
  );
  await qi.changeColumn('draft_versions', 'firstVersion', { type: DataTypes.INTEGER, allowNull: false });
  await qi.changeColumn('draft_versions', 'savedAt', { type: DataTypes.DATE, allowNull: false });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const column of ['savedAt', 'firstVersion', 'named']) await qi.removeColumn('draft_versions', column);
}
