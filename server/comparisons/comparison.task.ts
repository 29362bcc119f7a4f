// One comparison with its Monte Carlo run, from its input snapshot (JSON text in, JSON text out).
import { runComparison } from '../../shared/engine/lcca/comparison';
import type { ComparisonInput } from '../../shared/schemas/comparisons';
import { defineTask } from '../pool/task';

export default defineTask((inputJson: string, ctx) =>
  JSON.stringify(runComparison(JSON.parse(inputJson) as ComparisonInput, { onProgress: ctx.progress })),
);
