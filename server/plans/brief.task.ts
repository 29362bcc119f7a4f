// The council brief PDF, built in a worker from the plan, one finished run and the segment geometries.
import { defineTask } from '../pool/task';
import { briefPdf } from './brief-pdf';
import { agencyName, getPlan, runResult, segmentGeometries } from './plans.service';

export default defineTask(async (p: { agencyId: string; planId: string; runId: string; author: string }, ctx) => {
  const deps = { db: ctx.db() };
  return briefPdf({
    plan: getPlan(deps, p.agencyId, p.planId, 'engineer'),
    result: runResult(deps, p.agencyId, p.runId),
    geometries: segmentGeometries(deps, p.agencyId),
    author: p.author,
    agencyName: agencyName(deps, p.agencyId),
  });
});
