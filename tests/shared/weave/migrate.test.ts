import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DraftError, parseDraft } from '../../../shared/weave/draft';
import { DRAFT_MIGRATIONS, migrateDraft } from '../../../shared/weave/migrate';
import { DRAFT_SCHEMA_VERSION } from '../../../shared/weave/types';

// Documents as they were stored under each earlier format. Add one when the format changes; never
// edit or remove one: a weaver's stored versions of that age must keep loading.
const fixtureDir = join(import.meta.dirname, 'fixtures');
const fixtures = readdirSync(fixtureDir)
  .filter((f) => /^draft-v\d+.*\.json$/.test(f))
  .map((file) => ({ file, doc: JSON.parse(readFileSync(join(fixtureDir, file), 'utf8')) as Record<string, unknown> }));

function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null) {
    for (const v of Object.values(value)) deepFreeze(v);
    Object.freeze(value);
  }
  return value;
}

describe('migrateDraft', () => {
  it('has one step per version, in order, ending at the current version', () => {
    expect(DRAFT_MIGRATIONS.map((m) => m.from)).toEqual(Array.from({ length: DRAFT_SCHEMA_VERSION - 1 }, (_, i) => i + 1));
  });

  it('keeps a fixture of format 1, the first stored format', () => {
    expect(fixtures.some((f) => f.doc.schemaVersion === 1)).toBe(true);
  });

  it.each(fixtures)('loads the stored document $file without changing it', ({ doc }) => {
    const stored = deepFreeze(structuredClone(doc));
    const draft = parseDraft(stored);
    expect(draft.schemaVersion).toBe(DRAFT_SCHEMA_VERSION);
    expect(stored).toEqual(doc);
    expect(draft.threading).toEqual(doc.threading);
    expect(draft.shafts).toBe(doc.shafts);
  });

  it('reads format 1 with every field meaning what it meant when stored', () => {
    const { doc } = fixtures.find((f) => f.file === 'draft-v1.json')!;
    const draft = parseDraft(doc);
    expect(draft).toMatchObject({
      name: 'Two-layer sample, stored in format 1',
      control: 'liftplan',
      palette: ['#2b2b33', '#f3efe6', '#b0413e'],
      warpLayers: [1, 2, 1, 2, 1, 2, 1, 2],
      weftColors: [1, 2, 1, 2, 1, 2, 1, 2],
      sett: { warp: 16, weft: 16, unit: 'cm' },
      blocks: { warp: [1, 1, 1, 1, 2, 2, 2, 2], weft: [1, 1, 1, 1, 1, 1, 1, 1] },
    });
    expect(draft.liftplan).toHaveLength(8);
    expect(draft.treadling).toHaveLength(4);
  });

  it('upgrades step by step from the stored version, leaving the stored object as it was', () => {
    // Two made-up steps stand in for future format changes: 1 → 2 renames a field, 2 → 3 adds one.
    const steps = [
      { from: 1, change: 'notes renamed', up: ({ notes, ...rest }: Record<string, unknown>) => ({ ...rest, remarks: notes }) },
      { from: 2, change: 'remarks counted', up: (d: Record<string, unknown>) => ({ ...d, remarkLength: String(d.remarks).length }) },
    ];
    const v1 = deepFreeze({ schemaVersion: 1, notes: 'abc' });
    expect(migrateDraft(v1, steps)).toEqual({ schemaVersion: 3, remarks: 'abc', remarkLength: 3 });
    expect(v1).toEqual({ schemaVersion: 1, notes: 'abc' });
    expect(migrateDraft({ schemaVersion: 2, remarks: 'de' }, steps)).toEqual({ schemaVersion: 3, remarks: 'de', remarkLength: 2 });
    const v3 = { schemaVersion: 3 };
    expect(migrateDraft(v3, steps)).toBe(v3);
  });

  it('returns a current document as it is', () => {
    const doc = { schemaVersion: DRAFT_SCHEMA_VERSION, shafts: 4, threading: [] };
    expect(migrateDraft(doc)).toBe(doc);
  });

  it('leaves what it cannot read to parseDraft, which names the problem', () => {
    for (const bad of [null, 'draft', [], { shafts: 4 }, { schemaVersion: '1' }, { schemaVersion: 0 }, { schemaVersion: 1.5 }]) {
      expect(migrateDraft(bad)).toBe(bad);
    }
    const future = { schemaVersion: DRAFT_SCHEMA_VERSION + 1, shafts: 4, threading: [] };
    expect(migrateDraft(future)).toBe(future);
    expect(() => parseDraft(future)).toThrow(DraftError);
    expect(() => parseDraft(future)).toThrow(`${DRAFT_SCHEMA_VERSION + 1} is not a version this program reads`);
  });
});
