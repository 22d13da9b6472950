import { LRUCache } from 'lru-cache';
import type { Model, ModelStatic, Transaction } from 'sequelize';
import type { StudioRole } from '../../shared/api/auth';
import { singleProcess, type CacheRelay } from '../cluster/relay';
import type { DraftModel } from './draft';
import type { MembershipModel } from './membership';
import type { StudioModel } from './studio';
import type { UserModel } from './user';

/** The account fields a request needs, as read for the signed-in user. */
export interface AccountFields {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** The account fields of a user row; Boolean() because a plain row carries the column's 0 or 1. */
export const accountOf = (row: Pick<AccountFields, 'id' | 'email' | 'name'> & { isAdmin: unknown }): AccountFields =>
  ({ id: row.id, email: row.email, name: row.name, isAdmin: Boolean(row.isAdmin) });

/** Whose a draft is: enough to work out anyone's role on it. */
export interface DraftOwnership {
  ownerId: number;
  studioId: number | null;
}

/**
 * What requests read over and over — the signed-in account, the user's studio roles, each draft's
 * owner and studio, and library pages — kept in this process between requests: reading them from
 * MariaDB cost more than most requests' own work.
 *
 * Correctness rests on one rule: a write that could change an answer empties the cache holding it
 * when the write happens and again when its transaction commits, and a read that started before an
 * emptying does not store what it read. So a removed member or a deleted account loses access at the
 * next request, and a library page never misses a save. The writes are seen through model hooks, so
 * they must go through the models, or say what they wrote (draftSaved). Each process of the app
 * keeps its own caches; once a write has committed, the relay empties the other processes' too
 * before the write's request is answered (server/cluster/relay.ts). Servers on other machines
 * sharing one database turn the caches off (config.processCaches).
 */
export interface AccessCache {
  account(userId: number): Promise<AccountFields | null>;
  /** studioId → role for every studio the user belongs to. */
  studioRoles(userId: number): Promise<ReadonlyMap<number, StudioRole>>;
  draftOwnership(draftId: number): Promise<DraftOwnership | null>;
  /** A library page (or anything else read from drafts, users and studios) for one user and query. */
  libraryPage<V>(userId: number, queryKey: string, load: () => Promise<V>): Promise<V>;
  /**
   * Says a draft's document was saved in plain SQL, which runs no model hooks: library pages are out
   * of date. Called once the save has committed; a page read before then is dropped, not kept.
   * Resolves when every process has dropped its pages.
   */
  draftSaved(): Promise<void>;
  /** Empties this process's caches; tests call it. */
  invalidate(): void;
}

interface HookOptions {
  transaction?: Transaction | null;
  fields?: readonly PropertyKey[];
  attributes?: Record<string, unknown>;
  silent?: boolean;
}

/** An LRU map whose entries are dropped by any write; see AccessCache for the rule. */
function writeInvalidatedCache(max: number, enabled: boolean) {
  // Boxed so that "no such row" (null) is cached too.
  const entries = new LRUCache<string, { value: unknown }>({ max });
  let generation = 0;
  return {
    async read<V>(key: string, load: () => Promise<V>): Promise<V> {
      const hit = entries.get(key);
      if (hit) return hit.value as V;
      const started = generation;
      const value = await load();
      if (enabled && started === generation) entries.set(key, { value });
      return value;
    },
    invalidate() {
      generation += 1;
      entries.clear();
    },
  };
}

/**
 * Empties `caches` when a write happens and again when its transaction commits, then has the other
 * processes empty theirs: they cannot see the write before it commits. Hooks return the promise, so
 * Sequelize waits for the other processes before the write returns.
 */
function afterWrite(options: HookOptions | undefined, caches: { invalidate(): void }[], tellOthers: () => Promise<void>) {
  const empty = () => { for (const cache of caches) cache.invalidate(); };
  empty();
  if (!options?.transaction) return tellOthers();
  options.transaction.afterCommit(() => {
    empty();
    return tellOthers();
  });
  return undefined;
}

const OWNERSHIP_FIELDS: readonly PropertyKey[] = ['ownerId', 'studioId'];
/** Draft columns a library page does not show. */
const UNLISTED_FIELDS: readonly PropertyKey[] = ['thumbnail'];

type Watcher = (options: HookOptions) => Promise<void> | void;

/** Calls `onWrite` after every kind of write to `model`, with the write's options. */
function watchWrites(model: ModelStatic<Model>, onWrite: Watcher) {
  model.addHook('afterCreate', (_row: Model, options: HookOptions) => onWrite(options));
  model.addHook('afterBulkCreate', (_rows: Model[], options: HookOptions) => onWrite(options));
  model.addHook('afterUpdate', (_row: Model, options: HookOptions) => onWrite(options));
  model.addHook('afterBulkUpdate', (options: HookOptions) => onWrite(options));
  model.addHook('afterDestroy', (_row: Model, options: HookOptions) => onWrite(options));
  model.addHook('afterBulkDestroy', (options: HookOptions) => onWrite(options));
  model.addHook('afterUpsert', (_result: unknown, options: HookOptions) => onWrite(options));
}

/** The fields an update changes; undefined for creates and deletes. */
function updatedFields(options: HookOptions): readonly PropertyKey[] | undefined {
  const fields = options.fields ?? (options.attributes ? Object.keys(options.attributes) : undefined);
  // A silent update leaves updatedAt alone, though Sequelize still lists it among the fields.
  return options.silent ? fields?.filter((f) => f !== 'updatedAt') : fields;
}

/** The access cache over these models; when not `enabled` every read goes to the database. */
export function createAccessCache(
  models: { User: UserModel; Studio: StudioModel; Membership: MembershipModel; Draft: DraftModel },
  enabled: boolean,
  relay: CacheRelay = singleProcess,
): AccessCache {
  const access = writeInvalidatedCache(50_000, enabled);
  // A page of up to 100 drafts is some tens of kB: 500 of them stay within a few tens of MB.
  const library = writeInvalidatedCache(500, enabled);
  const tell = (kind: 'access' | 'library') => () => (enabled ? relay.publish({ kind }) : Promise.resolve());
  // 'access' empties both caches in the other processes, 'library' only the pages.
  relay.subscribe((drop) => {
    if (drop.kind === 'access') access.invalidate();
    if (drop.kind !== 'session') library.invalidate();
  });
  const everything: Watcher = (options) => afterWrite(options, [access, library], tell('access'));
  for (const model of [models.User, models.Studio, models.Membership]) watchWrites(model as unknown as ModelStatic<Model>, everything);
  // A save changes a draft's document, not whose it is; storing its thumbnail changes no list either.
  watchWrites(models.Draft as unknown as ModelStatic<Model>, (options) => {
    const fields = updatedFields(options);
    if (!fields || fields.some((f) => OWNERSHIP_FIELDS.includes(f))) return everything(options);
    if (fields.some((f) => !UNLISTED_FIELDS.includes(f))) return afterWrite(options, [library], tell('library'));
    return undefined;
  });

  return {
    account: (userId) => access.read(`account:${userId}`, async () => {
      const row = await models.User.findByPk(userId, { attributes: ['id', 'email', 'name', 'isAdmin'], raw: true });
      return row ? accountOf(row) : null;
    }),
    studioRoles: (userId) => access.read(`roles:${userId}`, async () => {
      const rows = await models.Membership.findAll({ where: { userId }, attributes: ['studioId', 'role'], raw: true });
      return new Map(rows.map((r) => [r.studioId, r.role]));
    }),
    draftOwnership: (draftId) => access.read(`draft:${draftId}`, async () => {
      const row = await models.Draft.findByPk(draftId, { attributes: ['ownerId', 'studioId'], raw: true });
      return row ? { ownerId: row.ownerId, studioId: row.studioId } : null;
    }),
    libraryPage: (userId, queryKey, load) => library.read(`${userId}:${queryKey}`, load),
    draftSaved: () => {
      library.invalidate();
      return tell('library')();
    },
    invalidate() {
      access.invalidate();
      library.invalidate();
    },
  };
}
