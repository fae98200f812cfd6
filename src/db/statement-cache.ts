import Database from 'libsql';

/**
 * Keeps each connection's prepared statements for reuse.
 *
 * @libsql/client prepares every statement afresh on every call (its local-file client has no
 * statement cache), and on a cached page read preparing was the largest single cost: a tenth of
 * the request's CPU for four small queries. SQLite itself is built for reuse: a prepared
 * statement is re-run with new bindings, and re-prepared by SQLite when the schema changes.
 *
 * Statements with "*" (a star select, count(*)) are never kept: see cachedPrepare.
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
    // With "*" the columns are fixed when the statement is prepared, and a schema change since
    // would leave a kept statement naming fewer columns than its rows carry: prepare it afresh.
    if (sql.includes('*')) return prepare.call(this, sql);
    let cache = caches.get(this);
    if (!cache) caches.set(this, (cache = new Map()));
    const known = cache.get(sql);
    if (known) {
      cache.delete(sql);
      cache.set(sql, known);
      return known;
    }
    const statement = prepare.call(this, sql);
    // The client asks a statement for its columns twice per run, a native call each time; a
    // statement that names its columns has the same ones for its whole life, so keep the answer.
    const columns = statement.columns.bind(statement);
    let columnsOnce: ReturnType<typeof columns> | undefined;
    statement.columns = () => (columnsOnce ??= columns());
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
