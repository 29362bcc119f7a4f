// What a task file sees. A task is the default export of a `*.task.ts` file,
// run in a worker thread of the pool (server/pool/pool.ts): it gets its payload
// (cloned, so plain data) and a context, and returns plain data or a Buffer.
import type { Db } from '../db/client';

export type TaskContext = {
  /** Report progress, 0 to 1; small steps are dropped, so call it as often as is convenient. */
  progress: (fraction: number) => void;
  /** A read-only connection to the app's database, opened once per worker thread. */
  db: () => Db;
  /**
   * A writable connection, opened once per worker thread. Keep each write transaction short (one row, or
   * chunks): the request thread's own writes wait while it is open.
   */
  writer: () => Db;
};

export type Task<I, O> = (input: I, ctx: TaskContext) => O | Promise<O>;

/** `export default defineTask((input: X, ctx) => …)`: the types flow to the caller's TaskRef. */
export const defineTask = <I, O>(fn: Task<I, O>) => fn;

/** A task file named by URL, with its input and output types, so callers are typed without loading it. */
export type TaskRef<I, O> = { href: string; _types?: (input: I) => O };

export function taskRef<F extends (input: never, ctx: TaskContext) => unknown>(
  url: URL,
): TaskRef<Parameters<F>[0], Awaited<ReturnType<F>>> {
  return { href: url.href };
}

/** An error as it crosses the thread boundary: HttpError's status, code and issues survive. */
export type TaskFailure = {
  message: string;
  status?: number;
  code?: string;
  issues?: { path: string; message: string }[];
  path?: string;
};
