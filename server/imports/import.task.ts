// One upload, read, checked and (unless a dry run or refused) written, in a worker of the pool.
// The file's bytes arrive moved from the request thread; a 400 naming the row, column and reason
// crosses back as it is, and so does the 422 report. The write is one transaction on this worker's
// own connection, so nothing of a failed import is ever visible.
import type { ImportOptions } from '../../shared/schemas/imports';
import { defineTask } from '../pool/task';
import { runImport } from './imports.service';

export type ImportTaskInput = {
  agencyId: string;
  userId: string;
  name: string;
  /** The uploaded file (a Buffer on the request thread; a Uint8Array once it has crossed). */
  bytes: Uint8Array;
  options: ImportOptions;
};

export default defineTask(async (p: ImportTaskInput, ctx) => {
  const db = ctx.writer();
  const buffer = Buffer.from(p.bytes.buffer, p.bytes.byteOffset, p.bytes.byteLength);
  // listCache is left out: it lives on the request thread, and the route bumps it.
  return runImport(
    { db, sqlite: db.$client, progress: ctx.progress },
    p.agencyId,
    p.userId,
    { name: p.name, buffer },
    p.options,
  );
});
