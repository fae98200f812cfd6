import Database from 'libsql';

/**
 * Keeps each connection's prepared statements for reuse.
 *
 * @libsql/client prepares every statement afresh on every call (its local-file client has no
 * statement cache), and on a cached page read preparing was the largest single cost: a tenth of
 * the request's CPU for four small queries. SQLite itself is built for reuse: a prepared
 * statement is re-run with new bindings, and re-prepared by SQLite when the schema changes.
 *
 * Reuse is safe here because the client runs each statement to completion synchronously
 * (`all()` or `run()`, with `raw` and `safeIntegers` set again before every use), so one
 * statement is never in two executions at once. Statements are cached per connection, bounded,
 * oldest use first out; an evicted statement is finalised by the garbage collector as before.
 */
const PER_CONNECTION = 200;

type Statement = ReturnType<Database.Database['prepare']>;
type Prepare = (this: Database.Database, sql: string) => Statement;

const caches = new WeakMap<object, Map<string, Statement>>();
const proto = (Database as unknown as { prototype: { prepare: Prepare; __throwlineCached?: true } }).prototype;

if (!proto.__throwlineCached) {
  const prepare = proto.prepare;
  proto.prepare = function cachedPrepare(this: Database.Database, sql: string): Statement {
    let cache = caches.get(this);
    if (!cache) caches.set(this, (cache = new Map()));
    const known = cache.get(sql);
    if (known) {
      cache.delete(sql);
      cache.set(sql, known);
      return known;
    }
    const statement = prepare.call(this, sql);
    cache.set(sql, statement);
    if (cache.size > PER_CONNECTION) cache.delete(cache.keys().next().value!);
    return statement;
  };
  proto.__throwlineCached = true;
}

/** How many statements a connection keeps (for tests). */
export function cachedStatementCount(connection: object): number {
  return caches.get(connection)?.size ?? 0;
}
