import type { Sequelize } from 'sequelize';

interface QueryPrototype {
  formatResults(data: unknown): unknown;
  shedwrightMetaFix?: true;
}

/**
 * NOTE: Sequelize 6's mariadb dialect runs `delete data.meta` on raw results, but connector 3.x makes
 * `meta` non-configurable, so raw queries without a `type` and `removeColumn`/`removeIndex` throw
 * "Cannot delete property 'meta'". Hand the formatter a plain array copy whose `meta` can be deleted.
 * Patches the dialect's shared prototype once; calling it again is harmless.
 */
export function applyMetaFix(sequelize: Sequelize): void {
  const dialect = sequelize.getDialect();
  if (dialect !== 'mariadb') return;
  const proto = (sequelize as unknown as { dialect: { Query: { prototype: QueryPrototype } } }).dialect.Query.prototype;
  if (proto.shedwrightMetaFix) return;
  const original = proto.formatResults;
  proto.formatResults = function formatResults(this: unknown, data: unknown) {
    if (Array.isArray(data) && Object.prototype.hasOwnProperty.call(data, 'meta')) {
      const copy: unknown[] & { meta?: unknown } = [...data];
      copy.meta = (data as unknown[] & { meta?: unknown }).meta;
      return original.call(this, copy);
    }
    return original.call(this, data);
  };
  proto.shedwrightMetaFix = true;
}
