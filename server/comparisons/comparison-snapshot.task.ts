// The self-contained input of a comparison (the group's quantities from the agency's segments, the catalog
// and economics as they are now) with the deterministic check, in a worker: a group can hold 50,000 segments.
// A saved comparison runs again from its own stored snapshot instead.
import type { ComparisonRequest } from '../../shared/schemas/comparisons';
import { defineTask } from '../pool/task';
import type { Snapshot } from '../runs/runs.service';
import { savedInput, comparisonInput } from './comparisons.service';

export default defineTask(
  (
    p: { agencyId: string; runId: string } & ({ request: ComparisonRequest } | { analysisId: string }),
    ctx,
  ): Snapshot => {
    const deps = { db: ctx.db() };
    if ('analysisId' in p) return { input: savedInput(deps, p.agencyId, p.analysisId) };
    return { input: JSON.stringify(comparisonInput(deps, p.agencyId, p.request)) };
  },
);
