import type { Statement } from 'better-sqlite3';
import type { Sqlite } from './client';

// Prepared statements kept per connection: the hot paths (every request's
// session, user and membership look-ups) prepare each SQL text once.
const caches = new WeakMap<Sqlite, Map<string, Statement>>();

export function statement(sqlite: Sqlite, sql: string): Statement {
  let cache = caches.get(sqlite);
  if (!cache) {
    cache = new Map();
    caches.set(sqlite, cache);
  }
  let s = cache.get(sql);
  if (!s) {
    s = sqlite.prepare(sql);
    cache.set(sql, s);
  }
  return s;
}

/** What the session store needs of a client, with its statements cached. */
export function cachingClient(sqlite: Sqlite) {
  return { prepare: (sql: string) => statement(sqlite, sql), exec: (sql: string) => sqlite.exec(sql) };
}
