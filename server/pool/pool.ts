// The one worker pool for heavy work (piscina). Every heavy task — a run that
// outlives its request, or a task a route awaits — first takes a slot: one
// global cap (the pool's threads) and caps per agency and per user, checked on
// the request thread before any work starts, so being over a cap answers 429 at
// once with Retry-After. A slot can run several tasks in turn (a run's snapshot,
// then the run itself) and is released when its owner is done with it.
import { randomUUID } from 'node:crypto';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { HttpError, tooBusy } from '../http/errors';
import type { TaskFailure, TaskRef } from './task';
import type { TaskAnswer, TaskMessage } from './task-runner';

export type PoolLimits = { threads: number; perAgency: number; perUser: number };
export type TaskOwner = { userId: string; agencyId: string | null };
export type RunOptions = {
  onProgress?: (fraction: number) => void;
  /** Bytes to move to the worker rather than copy (when they own their whole memory); unusable here afterwards. */
  transfer?: Uint8Array[];
  /** Aborting it stops the task (e.g. the client went away before the answer). */
  signal?: AbortSignal;
};

/** What a 429 asks the client to wait, in seconds: heavy tasks take seconds to minutes. */
export const RETRY_AFTER_SECONDS = 10;
const HOST = new URL('./task-host.mjs', import.meta.url).href;

/**
 * A task that failed for a reason of its own (not a 4xx): its message, the input field if it named one, and
 * its error code (SQLite's SQLITE_FULL, SQLITE_BUSY… keep their meaning: the error handler words them).
 */
export class TaskFailedError extends Error {
  constructor(
    message: string,
    public path?: string,
    public code?: string,
  ) {
    super(message);
  }
}

/** The pool was closed (the server is stopping) while the task ran: nobody cancelled it. */
export class PoolClosedError extends Error {}

function revive(f: TaskFailure): Error {
  if (f.status && f.status >= 400 && f.status < 500 && f.code)
    return new HttpError(f.status, f.code, f.message, f.issues);
  return new TaskFailedError(f.message, f.path, f.code);
}

export class Slot {
  readonly id = randomUUID();
  progress = 0;
  private abort = new AbortController();
  private released = false;

  constructor(
    private pool: WorkerPool,
    readonly owner: TaskOwner,
    /** Set for runs: the run id, so a poll or a cancel finds the slot. */
    readonly key: string | null,
  ) {}

  get cancelled() {
    return this.abort.signal.aborted;
  }

  /** Runs one task in a worker; rejects with HttpError (4xx from the task), TaskFailedError, or an abort. */
  async run<I, O>(task: TaskRef<I, O>, payload: I, opts: RunOptions = {}): Promise<O> {
    if (this.released) throw new Error('this slot was released');
    const { port1, port2 } = new MessageChannel();
    port1.on('message', (f: number) => {
      this.progress = f;
      opts.onProgress?.(f);
    });
    const message: TaskMessage = { href: task.href, payload, port: port2, databasePath: this.pool.databasePath };
    const stop = () => this.cancel();
    opts.signal?.addEventListener('abort', stop);
    if (opts.signal?.aborted) this.cancel();
    try {
      const answer = (await this.pool.piscina.run(message, {
        transferList: [
          port2,
          ...(opts.transfer ?? [])
            .filter((b) => b.byteOffset === 0 && b.byteLength === b.buffer.byteLength)
            .map((b) => b.buffer as ArrayBuffer),
        ],
        signal: this.abort.signal,
      })) as TaskAnswer;
      if (!answer.ok) throw revive(answer.error);
      return answer.value as O;
    } catch (err) {
      if (this.pool.closing) throw new PoolClosedError('the server is stopping');
      if (this.abort.signal.aborted) throw new TaskFailedError('cancelled');
      if (err instanceof HttpError || err instanceof TaskFailedError) throw err;
      // The worker itself died (out of memory, a crash in native code).
      throw new TaskFailedError(`the worker stopped unexpectedly (${(err as Error).message})`);
    } finally {
      opts.signal?.removeEventListener('abort', stop);
      port1.close();
    }
  }

  /** Stops the running task: its worker thread is terminated. */
  cancel() {
    this.abort.abort();
  }

  release() {
    if (this.released) return;
    this.released = true;
    this.pool.free(this);
  }
}

export class WorkerPool {
  readonly piscina: Piscina;
  closing = false;
  private slots = new Set<Slot>();

  constructor(
    readonly limits: PoolLimits,
    readonly databasePath: string,
  ) {
    this.piscina = new Piscina({
      filename: HOST,
      minThreads: 0,
      maxThreads: limits.threads,
      // A warm thread has tsx and the task modules loaded (a cold one took ~4 s here); keep it a while.
      idleTimeout: 5 * 60_000,
      atomics: 'disabled',
      // Workers run at a lower priority than the request thread, so on a busy machine answers come
      // first and heavy work takes the CPU left over (needs piscina's optional @napi-rs/nice; else no-op).
      niceIncrement: 10,
    });
  }

  /** Takes a slot or throws 429 naming the cap that was hit. */
  reserve(owner: TaskOwner, key: string | null = null): Slot {
    const tasks = (n: number) => `${n} heavy ${n === 1 ? 'task' : 'tasks'}`;
    const mine = [...this.slots].filter((s) => s.owner.userId === owner.userId).length;
    if (mine >= this.limits.perUser)
      throw tooBusy(
        `You already have ${tasks(mine)} going (runs, exports or the brief), the most one person can run at once. Wait for one to finish or cancel a run, then try again.`,
        RETRY_AFTER_SECONDS,
      );
    if (owner.agencyId) {
      const agency = [...this.slots].filter((s) => s.owner.agencyId === owner.agencyId).length;
      if (agency >= this.limits.perAgency)
        throw tooBusy(
          `This agency already has ${tasks(agency)} going, the most one agency can run at once. Wait for one to finish or cancel a run, then try again.`,
          RETRY_AFTER_SECONDS,
        );
    }
    if (this.slots.size >= this.limits.threads)
      throw tooBusy(
        `The server is busy: all ${this.limits.threads} of its workers are on heavy tasks. Try again in a few seconds.`,
        RETRY_AFTER_SECONDS,
      );
    const slot = new Slot(this, owner, key);
    this.slots.add(slot);
    return slot;
  }

  /** Takes a slot, runs one task in it and gives the slot back: for routes that await a heavy answer. */
  async run<I, O>(task: TaskRef<I, O>, payload: I, owner: TaskOwner, opts?: RunOptions): Promise<O> {
    const slot = this.reserve(owner);
    try {
      return await slot.run(task, payload, opts);
    } finally {
      slot.release();
    }
  }

  /** The slot holding a run, while it runs in this process. */
  find(key: string) {
    for (const s of this.slots) if (s.key === key) return s;
    return null;
  }

  get busy() {
    return this.slots.size;
  }

  free(slot: Slot) {
    this.slots.delete(slot);
  }

  /** Stops every worker. Runs cut off here stay marked running; the next start marks them interrupted. */
  async close() {
    this.closing = true;
    await this.piscina.destroy();
  }
}
