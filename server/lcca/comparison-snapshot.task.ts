// The self-contained input of a comparison (the group's quantities from the agency's segments, the catalog
// and economics as they are now) with the deterministic check, in a worker: a group can hold 50,000 segments.
// A saved comparison runs again from its own stored snapshot instead.
import type { StudyRequest } from '../../shared/schemas/lcca';
import { defineTask } from '../pool/task';
import type { Snapshot } from '../runs/runs.service';
import { savedInput, studyInput } from './lcca.service';

export default defineTask(
  (p: { agencyId: string; runId: string } & ({ request: StudyRequest } | { analysisId: string }), ctx): Snapshot => {
    const deps = { db: ctx.db() };
    if ('analysisId' in p) return { input: savedInput(deps, p.agencyId, p.analysisId) };
    return { input: JSON.stringify(studyInput(deps, p.agencyId, p.request)) };
  },
);
