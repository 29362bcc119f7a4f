// Heavy work (Monte Carlo studies, network plans) runs in worker threads, off
// the request thread. A run reports progress, can be cancelled, and is kept in
// memory for an hour after it ends; callers poll it by id.
import { randomUUID } from 'node:crypto';
import { Worker } from 'node:worker_threads';
import { HttpError } from '../http/errors';

export type RunState = {
  id: string;
  agencyId: string;
  kind: string;
  status: 'running' | 'done' | 'failed' | 'cancelled';
  progress: number;
  result?: unknown;
  error?: { message: string; path?: string };
  startedAt: string;
  endedAt?: string;
};

const bootstrap = new URL('./ts-worker.mjs', import.meta.url);
const KEEP_MS = 60 * 60 * 1000;

export class JobRunner {
  private runs = new Map<string, RunState & { worker?: Worker; onEnd?: (r: RunState) => void }>();
  constructor(private maxPerAgency = 2) {}

  start(agencyId: string, kind: string, taskUrl: URL, payload: unknown, onEnd?: (r: RunState) => void): RunState {
    const active = [...this.runs.values()].filter((r) => r.agencyId === agencyId && r.status === 'running').length;
    if (active >= this.maxPerAgency)
      throw new HttpError(
        429,
        'too_many_runs',
        `This agency already has ${active} heavy runs going; wait for one to finish or cancel it`,
      );
    const id = randomUUID();
    const worker = new Worker(bootstrap, { workerData: { entry: taskUrl.href, payload } });
    const run: RunState & { worker?: Worker; onEnd?: (r: RunState) => void } = {
      id,
      agencyId,
      kind,
      status: 'running',
      progress: 0,
      startedAt: new Date().toISOString(),
      worker,
      onEnd,
    };
    this.runs.set(id, run);
    const end = (patch: Partial<RunState>) => {
      if (run.status !== 'running') return;
      Object.assign(run, patch, { endedAt: new Date().toISOString() });
      run.worker = undefined;
      void worker.terminate();
      run.onEnd?.(this.view(run));
      setTimeout(() => this.runs.delete(id), KEEP_MS).unref();
    };
    worker.on(
      'message',
      (m: { type: string; progress?: number; result?: unknown; error?: { message: string; path?: string } }) => {
        if (m.type === 'progress') run.progress = m.progress ?? run.progress;
        else if (m.type === 'done') end({ status: 'done', progress: 1, result: m.result });
        else if (m.type === 'error') end({ status: 'failed', error: m.error });
      },
    );
    worker.on('error', (err) => end({ status: 'failed', error: { message: err.message } }));
    worker.on('exit', (code) => {
      if (run.status === 'running') end({ status: 'failed', error: { message: `the worker stopped (exit ${code})` } });
    });
    return this.view(run);
  }

  get(agencyId: string, id: string): RunState {
    const r = this.runs.get(id);
    if (!r || r.agencyId !== agencyId) throw new HttpError(404, 'not_found', 'No such run');
    return this.view(r);
  }

  cancel(agencyId: string, id: string): RunState {
    const r = this.runs.get(id);
    if (!r || r.agencyId !== agencyId) throw new HttpError(404, 'not_found', 'No such run');
    if (r.status === 'running') {
      r.status = 'cancelled';
      r.endedAt = new Date().toISOString();
      void r.worker?.terminate();
      r.worker = undefined;
      r.onEnd?.(this.view(r));
    }
    return this.view(r);
  }

  async close() {
    await Promise.all([...this.runs.values()].map((r) => r.worker?.terminate()));
  }

  private view(r: RunState): RunState {
    const { id, agencyId, kind, status, progress, result, error, startedAt, endedAt } = r;
    return { id, agencyId, kind, status, progress, result, error, startedAt, endedAt };
  }
}
