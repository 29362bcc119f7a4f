// How long the database's write lock was held at a stretch: a side connection tries BEGIN IMMEDIATE
// (without waiting) every 5 ms. The longest run of refusals is the longest any request-thread write
// (a session touch, an edit, an audit entry) would have waited for a worker's transaction.
import Database from 'better-sqlite3';

export function probeWriteLock(dbPath: string) {
  const db = new Database(dbPath, { fileMustExist: true });
  db.pragma('busy_timeout = 0');
  let blockedSince: number | null = null;
  let longest = 0;
  const timer = setInterval(() => {
    const now = performance.now();
    try {
      db.exec('BEGIN IMMEDIATE');
      db.exec('ROLLBACK');
      if (blockedSince !== null) longest = Math.max(longest, now - blockedSince);
      blockedSince = null;
    } catch {
      blockedSince ??= now;
    }
  }, 5);
  return () => {
    clearInterval(timer);
    if (blockedSince !== null) longest = Math.max(longest, performance.now() - blockedSince);
    db.close();
    return longest;
  };
}
