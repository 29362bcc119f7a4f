// A test-only task: caps the file size (SQLite's max_page_count) on the writable connection of the worker
// thread it runs in, so the next write there fails with SQLITE_FULL as on a full disk. null lifts the cap.
import { defineTask } from '../../server/pool/task';

export default defineTask((p: { extraPages: number | null }, ctx) => {
  const w = ctx.writer().$client;
  const pages = w.pragma('page_count', { simple: true }) as number;
  w.pragma(`max_page_count = ${p.extraPages === null ? 4294967294 : pages + p.extraPages}`);
  return pages;
});
