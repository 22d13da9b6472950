type DocumentFields = Record<string, unknown>;

/**
 * One upgrade of the stored draft document, from version `from` to `from + 1`. `up` returns a new
 * object and never changes the one it is given: stored versions are read, upgraded in memory and
 * never rewritten. It need not set `schemaVersion`; {@link migrateDraft} does.
 */
export interface DraftMigration {
  from: number;
  /** What changed, in one sentence (docs/draft-format.md lists the same). */
  change: string;
  up: (doc: Readonly<DocumentFields>) => DocumentFields;
}

/**
 * Every upgrade in order: entry i takes version i + 1 to i + 2, and the last ends at
 * DRAFT_SCHEMA_VERSION. To change the format, bump DRAFT_SCHEMA_VERSION in types.ts, add a step
 * here, and keep a fixture of the old version in tests/shared/weave/fixtures/.
 */
export const DRAFT_MIGRATIONS: readonly DraftMigration[] = [
  {
    from: 1,
    change: 'adds the block design a draft was expanded from (`profile`), optional; nothing stored before changes meaning',
    up: (doc) => ({ ...doc }),
  },
  {
    from: 2,
    change:
      'adds the arrangement (`arrangement`: end 1 left or right, threading above or below, treadling right or left, shaft 1 at the bottom or top), optional; a document without one is laid out as the editor showed it (end 1 on the left, threading above, treadling on the right, shaft 1 at the bottom)',
    up: (doc) => ({ ...doc }),
  },
];

/**
 * Upgrades a stored draft document of any older schema version, one step at a time, to the
 * version {@link parseDraft} reads (parseDraft calls it first, so every reader of stored drafts
 * gets the upgrade). A document already current, of an unknown version, or not a document at all
 * comes back as it was, for parseDraft to accept or to report.
 *
 * `steps` is for tests of the stepping itself; the current version is always `steps.length + 1`.
 *
 * @example parseDraft(migrateDraft(storedVersion.document))
 */
export function migrateDraft(doc: unknown, steps: readonly DraftMigration[] = DRAFT_MIGRATIONS): unknown {
  if (typeof doc !== 'object' || doc === null || Array.isArray(doc)) return doc;
  const start = (doc as DocumentFields).schemaVersion;
  if (typeof start !== 'number' || !Number.isInteger(start) || start < 1 || start > steps.length) return doc;
  let current = doc as DocumentFields;
  for (const step of steps.slice(start - 1)) {
    current = { ...step.up(current), schemaVersion: step.from + 1 };
  }
  return current;
}
