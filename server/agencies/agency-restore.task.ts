// An agency archive restored into a new agency, in a worker of the pool: the archive's bytes arrive
// moved from the request thread; unzipping (under its byte cap), every file's check and the one
// all-or-nothing transaction run here, on this worker's own connection. A 400 naming the file, row and
// field crosses back as it is.
import { defineTask } from '../pool/task';
import { restoreAgency } from './agency-restore';

export default defineTask(async (p: { userId: string; bytes: Uint8Array; name?: string }, ctx) => {
  const buffer = Buffer.from(p.bytes.buffer, p.bytes.byteOffset, p.bytes.byteLength);
  // listCache is left out: it lives on the request thread, and the route bumps it.
  return restoreAgency({ db: ctx.writer() }, p.userId, buffer, p.name);
});
