// The self-contained input of a comparison (the group's quantities from the agency's segments, the catalog
// and economics as they are now) with the deterministic check, in a worker: a group can hold 50,000 segments.
import type { StudyRequest } from '../../shared/schemas/lcca';
import { defineTask } from '../pool/task';
import { studyInput } from './lcca.service';

export default defineTask((p: { agencyId: string; request: StudyRequest }, ctx) => ({
  input: JSON.stringify(studyInput({ db: ctx.db() }, p.agencyId, p.request)),
}));
