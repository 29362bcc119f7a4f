// The stateless optimiser (POST /api/plan/optimize), every method, in a worker: the body (up to 1 MB,
// 20,000 options for exact) is parsed and checked here too, so the request thread only reads its bytes.
// The object form is packed (shared/engine/plan/optimize.ts: costs in a repeated year add up),
// solved by solvePlan, and unpacked into ids again.
import { type Instance, pack, unpack } from '../../shared/engine/plan/optimize';
import { solvePlan } from '../../shared/engine/plan/solve';
import { OptimizeBodySchema } from '../../shared/schemas/plans';
import { HttpError } from '../http/errors';
import { parseJsonBody } from '../http/validate';
import { defineTask } from '../pool/task';
import { loadSolver } from './highs';

export const MAX_EXACT_STATELESS = 20_000;

export default defineTask(async (bytes: Uint8Array) => {
  const body = parseJsonBody(OptimizeBodySchema, bytes);
  const inst: Instance = {
    budgets: body.budgets,
    segments: body.segments.map((s) => ({
      id: s.id,
      priority: s.priority,
      options: s.options.map((o) => ({
        id: o.id,
        benefit: o.benefit,
        costs: o.costs ?? [{ year: o.year!, cost: o.cost! }],
      })),
    })),
  };
  const options = inst.segments.reduce((n, s) => n + s.options.length, 0);
  if (body.method === 'exact' && options > MAX_EXACT_STATELESS)
    throw new HttpError(
      400,
      'invalid_request',
      `Invalid request: method — the exact method takes at most ${MAX_EXACT_STATELESS.toLocaleString('en-US')} options here; use fast`,
      [{ path: 'body.method', message: 'too many options for exact' }],
    );
  const packed = pack(inst);
  const highs = body.method === 'exact' ? await loadSolver() : null;
  return unpack(inst, packed, solvePlan(packed, body.method, highs, { timeLimitSeconds: body.timeLimitSeconds }));
});
