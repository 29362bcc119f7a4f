// One comparison with its Monte Carlo run, from its input snapshot (JSON text in, JSON text out).
import { runStudy } from '../../shared/engine/lcca/study';
import type { StudyInput } from '../../shared/schemas/lcca';
import { defineTask } from '../pool/task';

export default defineTask((inputJson: string, ctx) =>
  JSON.stringify(runStudy(JSON.parse(inputJson) as StudyInput, { onProgress: ctx.progress })),
);
