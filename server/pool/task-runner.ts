// Worker side of the pool: loads the task file, gives it a context (progress
// through a MessagePort, a read-only database), and answers { ok, value } or
// { ok: false, error } so that errors keep their status, code and field path.
import type { MessagePort } from 'node:worker_threads';
import { type Db, openReadOnlyDb, openWriteDb } from '../db/client';
import type { Task, TaskFailure } from './task';

export type TaskMessage = { href: string; payload: unknown; port: MessagePort; databasePath: string };
export type TaskAnswer = { ok: true; value: unknown } | { ok: false; error: TaskFailure };

// One of each per worker thread, for the database the pool was made for.
const connections = { read: null as { path: string; db: Db } | null, write: null as { path: string; db: Db } | null };

function connection(kind: 'read' | 'write', path: string) {
  const c = connections[kind];
  if (c?.path === path) return c.db;
  c?.db.$client.close();
  const db = kind === 'read' ? openReadOnlyDb(path) : openWriteDb(path);
  connections[kind] = { path, db };
  return db;
}

function failure(err: unknown): TaskFailure {
  const e = err as { message?: unknown; status?: unknown; code?: unknown; issues?: unknown; path?: unknown };
  return {
    message: typeof e?.message === 'string' ? e.message : String(err),
    status: typeof e?.status === 'number' ? e.status : undefined,
    code: typeof e?.code === 'string' ? e.code : undefined,
    issues: Array.isArray(e?.issues) ? (e.issues as TaskFailure['issues']) : undefined,
    path: typeof e?.path === 'string' ? e.path : undefined,
  };
}

export async function runTask({ href, payload, port, databasePath }: TaskMessage): Promise<TaskAnswer> {
  let last = -1;
  const ctx = {
    progress: (f: number) => {
      if (f - last < 0.01 && f < 1) return;
      last = f;
      port.postMessage(Math.max(0, Math.min(1, f)));
    },
    db: () => connection('read', databasePath),
    writer: () => connection('write', databasePath),
  };
  try {
    const mod = (await import(href)) as { default: Task<unknown, unknown> };
    return { ok: true, value: await mod.default(payload, ctx) };
  } catch (err) {
    return { ok: false, error: failure(err) };
  } finally {
    port.close();
  }
}
