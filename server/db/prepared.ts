// Hot read queries built once per database and sent as named prepared statements: drizzle then
// builds no SQL per request and PostgreSQL plans each once per connection. Only for the pool;
// inside a transaction the plain query builder runs on the transaction's connection.
import type { Db, Queryable } from "./client";

const built = new WeakMap<Db, Map<string, unknown>>();

/** The query `build` makes for this database, made on first use. */
export function preparedOn<Q>(db: Db, name: string, build: (db: Db) => Q): Q {
  let queries = built.get(db);
  if (!queries) built.set(db, (queries = new Map()));
  let query = queries.get(name) as Q | undefined;
  if (query === undefined) queries.set(name, (query = build(db)));
  return query;
}

/** The pool's handle, or undefined inside a transaction. */
export const poolDb = (q: Queryable): Db | undefined => ("$client" in q ? q : undefined);
