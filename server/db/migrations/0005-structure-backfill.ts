import { QueryTypes, type QueryInterface } from 'sequelize';
import { DraftError, parseDraft } from '../../../shared/weave';
import { structureTags } from '../../services/draft-derived';

const BATCH = 200;

/**
 * 0003 gave drafts that existed before structure tags an empty list, so the library's structure
 * filter never found them. Works the tags out from each such draft's document, a batch at a time.
 * Plain SQL leaves `updatedAt` alone: nobody changed these drafts.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  let after = 0;
  for (;;) {
    const rows = await qi.sequelize.query<{ id: number; document: unknown }>(
      'SELECT `id`, `document` FROM `drafts` WHERE `id` > ? AND JSON_LENGTH(`structure`) = 0 ORDER BY `id` LIMIT ?',
      { replacements: [after, BATCH], type: QueryTypes.SELECT },
    );
    if (rows.length === 0) return;
    for (const row of rows) {
      let tags: string[];
      try {
        tags = structureTags(parseDraft(typeof row.document === 'string' ? JSON.parse(row.document) : row.document));
      } catch (err) {
        // Every stored document passed parseDraft when it was saved; one that no longer does keeps no tags.
        if (err instanceof DraftError || err instanceof SyntaxError) continue;
        throw err;
      }
      if (tags.length > 0) {
        await qi.sequelize.query('UPDATE `drafts` SET `structure` = ? WHERE `id` = ?', { replacements: [JSON.stringify(tags), row.id], type: QueryTypes.UPDATE });
      }
    }
    after = rows[rows.length - 1].id;
  }
}

/** Nothing to undo: the tags describe the documents, and 0003's down removes the column. */
export async function down(): Promise<void> {}
