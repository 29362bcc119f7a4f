import { and, asc, desc, eq } from 'drizzle-orm';
import type { Statement } from 'better-sqlite3';
import type { Db, Sqlite } from '../db/client';
import { importMappings, imports, segments, surveys, users } from '../db/schema';
import { FIELD_OF } from './segment-changes';

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export function savedMapping(db: Db, agencyId: string, kind: string): unknown {
  const row = db
    .select({ mapping: importMappings.mapping })
    .from(importMappings)
    .where(and(eq(importMappings.agencyId, agencyId), eq(importMappings.kind, kind)))
    .get();
  return row ? JSON.parse(row.mapping) : null;
}

/** A column mapping (kind segments / surveys) or a value matching (kind segments-values). */
export function saveMapping(tx: Tx, agencyId: string, kind: string, mapping: unknown) {
  tx.insert(importMappings)
    .values({ agencyId, kind, mapping: JSON.stringify(mapping) })
    .onConflictDoUpdate({
      target: [importMappings.agencyId, importMappings.kind],
      set: { mapping: JSON.stringify(mapping), updatedAt: new Date().toISOString() },
    })
    .run();
}

/** The agency's saved column mappings, by kind, for its archive. */
export function archiveMappings(db: Pick<Db, 'select'>, agencyId: string) {
  return db
    .select()
    .from(importMappings)
    .where(eq(importMappings.agencyId, agencyId))
    .orderBy(asc(importMappings.kind))
    .all();
}

export function existingSegments(db: Db, agencyId: string) {
  const rows = db.select().from(segments).where(eq(segments.agencyId, agencyId)).all();
  return new Map(rows.map((r) => [r.segmentId, r]));
}

export function existingSurveyKeys(db: Db, agencyId: string) {
  const rows = db
    .select({ segmentRef: surveys.segmentRef, surveyDate: surveys.surveyDate, pci: surveys.pci })
    .from(surveys)
    .where(eq(surveys.agencyId, agencyId))
    .all();
  return new Map(rows.map((r) => [`${r.segmentRef}|${r.surveyDate}`, r.pci]));
}

export function importHistory(db: Db, agencyId: string) {
  return db
    .select({
      id: imports.id,
      fileName: imports.fileName,
      kind: imports.kind,
      format: imports.format,
      mode: imports.mode,
      added: imports.added,
      updated: imports.updated,
      unchanged: imports.unchanged,
      rejected: imports.rejected,
      userName: users.name,
      createdAt: imports.createdAt,
    })
    .from(imports)
    .leftJoin(users, eq(users.id, imports.userId))
    .where(eq(imports.agencyId, agencyId))
    .orderBy(desc(imports.createdAt))
    .limit(100)
    .all();
}

/** The import's history row, with its counts and the rejected rows as CSV. */
export function insertImport(
  tx: Tx,
  row: Omit<typeof imports.$inferInsert, 'added' | 'updated' | 'unchanged' | 'rejected'> & {
    report: { added: number; updated: number; unchanged: number; rejected: number };
  },
) {
  const { report, ...rest } = row;
  tx.insert(imports)
    .values({
      ...rest,
      fileName: rest.fileName.slice(0, 200),
      added: report.added,
      updated: report.updated,
      unchanged: report.unchanged,
      rejected: report.rejected,
    })
    .run();
}

export function rejectedCsv(db: Db, agencyId: string, importId: string) {
  return db
    .select({ csv: imports.rejectedCsv, fileName: imports.fileName })
    .from(imports)
    .where(and(eq(imports.agencyId, agencyId), eq(imports.id, importId)))
    .get();
}

const COLUMN = FIELD_OF;

/**
 * Prepared statements for the import's write loop: tens of thousands of rows
 * go through here, so it skips the query builder (measured in bench/import.bench.ts).
 * Call only inside the caller's transaction.
 */
export function segmentWriter(sqlite: Sqlite, agencyId: string) {
  const cache = new Map<string, Statement>();
  const stmt = (key: string, build: () => string) => {
    let s = cache.get(key);
    if (!s) {
      s = sqlite.prepare(build());
      cache.set(key, s);
    }
    return s;
  };
  const surveyUpsert = sqlite.prepare(
    'INSERT INTO surveys (agency_id, segment_ref, survey_date, pci, source) VALUES (?, ?, ?, ?, ?) ON CONFLICT (segment_ref, survey_date) DO UPDATE SET pci = excluded.pci, source = excluded.source',
  );
  const liftLatest = sqlite.prepare(
    'UPDATE segments SET pci = ?, pci_date = ? WHERE id = ? AND (pci_date IS NULL OR pci_date <= ?)',
  );
  const setPci = sqlite.prepare('UPDATE segments SET pci = ? WHERE id = ?');
  const audit = sqlite.prepare(
    'INSERT INTO audit_log (agency_id, user_id, action, entity, entity_id, detail) VALUES (?, ?, ?, ?, ?, ?)',
  );
  return {
    insert(segmentId: string, patch: Record<string, unknown>): number {
      const keys = Object.keys(patch).sort();
      const s = stmt(
        `i:${keys.join(',')}`,
        () =>
          `INSERT INTO segments (agency_id, segment_id, ${keys.map((k) => COLUMN[k]).join(', ')}) VALUES (?, ?, ${keys.map(() => '?').join(', ')})`,
      );
      return Number(s.run(agencyId, segmentId, ...keys.map((k) => patch[k] ?? null)).lastInsertRowid);
    },
    update(segmentRef: number, patch: Record<string, unknown>, at: string) {
      const keys = Object.keys(patch).sort();
      const s = stmt(
        `u:${keys.join(',')}`,
        () =>
          `UPDATE segments SET ${keys.map((k) => `${COLUMN[k]} = ?`).join(', ')}, updated_at = ? WHERE id = ? AND agency_id = ?`,
      );
      s.run(...keys.map((k) => patch[k] ?? null), at, segmentRef, agencyId);
    },
    survey(segmentRef: number, surveyDate: string, pci: number, source: string | null) {
      surveyUpsert.run(agencyId, segmentRef, surveyDate, pci, source);
      liftLatest.run(pci, surveyDate, segmentRef, surveyDate);
    },
    latestPci(segmentRef: number, pci: number) {
      setPci.run(pci, segmentRef);
    },
    /** One audit row per changed segment, written in the import's own transaction. */
    audit(userId: string, action: string, segmentId: string, detail: unknown) {
      audit.run(agencyId, userId, action, 'segment', segmentId, JSON.stringify(detail));
    },
  };
}

const STAGED = Object.keys(COLUMN);

/**
 * New segments, staged before the import's transaction opens: rows go one by one into a TEMP table of this
 * connection (its own database, so filling it takes no lock on the app's file), and the transaction then
 * makes them visible with a few INSERT … SELECT statements — the segments (with their latest PCI), their
 * audit rows and their surveys. The write lock is held only for that set-based step.
 */
export function stagedAdds(sqlite: Sqlite) {
  sqlite.exec(
    `CREATE TEMP TABLE IF NOT EXISTS import_stage (seq INTEGER PRIMARY KEY, segment_id TEXT NOT NULL, keyset TEXT NOT NULL, ${STAGED.map((k) => COLUMN[k]).join(', ')}, pci REAL, pci_date TEXT, audit TEXT NOT NULL)`,
  );
  sqlite.exec('DELETE FROM temp.import_stage');
  const stage = sqlite.prepare(
    `INSERT INTO temp.import_stage (segment_id, keyset, ${STAGED.map((k) => COLUMN[k]).join(', ')}, pci, pci_date, audit) VALUES (${['?', '?', ...STAGED.map(() => '?'), '?', '?', '?'].join(', ')})`,
  );
  const keysets = new Set<string>();
  return {
    /** Outside the transaction: one new segment, its patch, its PCI (with the survey date, if any) and its audit detail. */
    add(segmentId: string, patch: Record<string, unknown>, pci: number | null, pciDate: string | null, audit: unknown) {
      const keys = Object.keys(patch).sort().join(',');
      keysets.add(keys);
      stage.run(
        segmentId,
        keys,
        ...STAGED.map((k) => patch[k] ?? null),
        pci,
        pci_date(pci, pciDate),
        JSON.stringify(audit),
      );
    },
    /** Inside the caller's transaction: the staged rows become the agency's, in the order they were staged. */
    commit(agencyId: string, userId: string, surveySource: string) {
      for (const keyset of keysets) {
        const cols = keyset.split(',').map((k) => COLUMN[k]);
        sqlite
          .prepare(
            `INSERT INTO segments (agency_id, segment_id, ${cols.join(', ')}, pci, pci_date) SELECT ?, segment_id, ${cols.join(', ')}, pci, pci_date FROM temp.import_stage WHERE keyset = ? ORDER BY seq`,
          )
          .run(agencyId, keyset);
      }
      sqlite
        .prepare(
          "INSERT INTO audit_log (agency_id, user_id, action, entity, entity_id, detail) SELECT ?, ?, 'segment.import.add', 'segment', segment_id, audit FROM temp.import_stage ORDER BY seq",
        )
        .run(agencyId, userId);
      sqlite
        .prepare(
          'INSERT INTO surveys (agency_id, segment_ref, survey_date, pci, source) SELECT ?, s.id, st.pci_date, st.pci, ? FROM temp.import_stage st JOIN segments s ON s.agency_id = ? AND s.segment_id = st.segment_id WHERE st.pci IS NOT NULL AND st.pci_date IS NOT NULL ORDER BY st.seq',
        )
        .run(agencyId, surveySource, agencyId);
    },
    /** After the transaction (or its failure): the stage is emptied. */
    clear() {
      sqlite.exec('DELETE FROM temp.import_stage');
    },
  };
}

/** A PCI without a survey date sets only the latest PCI; with one, the date too (the survey carries it). */
const pci_date = (pci: number | null, pciDate: string | null) => (pci === null ? null : pciDate);

/**
 * Survey rows, staged like new segments (see stagedAdds): into a TEMP table outside the transaction, then
 * one upsert of them all and one lift of each segment's latest PCI inside it. The lift takes, per segment,
 * the staged survey with the latest date (the later row of equal dates) and applies it when it is not
 * older than the segment's own — what upserting the rows one by one in file order did.
 */
export function stagedSurveys(sqlite: Sqlite) {
  sqlite.exec(
    'CREATE TEMP TABLE IF NOT EXISTS survey_stage (seq INTEGER PRIMARY KEY, segment_ref INTEGER NOT NULL, survey_date TEXT NOT NULL, pci REAL NOT NULL, source TEXT)',
  );
  sqlite.exec('DELETE FROM temp.survey_stage');
  const stage = sqlite.prepare(
    'INSERT INTO temp.survey_stage (segment_ref, survey_date, pci, source) VALUES (?, ?, ?, ?)',
  );
  return {
    add(segmentRef: number, surveyDate: string, pci: number, source: string | null) {
      stage.run(segmentRef, surveyDate, pci, source);
    },
    commit(agencyId: string) {
      sqlite
        .prepare(
          'INSERT INTO surveys (agency_id, segment_ref, survey_date, pci, source) SELECT ?, segment_ref, survey_date, pci, source FROM temp.survey_stage WHERE true ORDER BY seq ON CONFLICT (segment_ref, survey_date) DO UPDATE SET pci = excluded.pci, source = excluded.source',
        )
        .run(agencyId);
      sqlite
        .prepare(
          `UPDATE segments SET pci = latest.pci, pci_date = latest.survey_date
           FROM (SELECT segment_ref, survey_date, pci FROM (
                   SELECT segment_ref, survey_date, pci,
                          row_number() OVER (PARTITION BY segment_ref ORDER BY survey_date DESC, seq DESC) AS k
                   FROM temp.survey_stage) WHERE k = 1) AS latest
           WHERE segments.id = latest.segment_ref AND segments.agency_id = ?
             AND (segments.pci_date IS NULL OR segments.pci_date <= latest.survey_date)`,
        )
        .run(agencyId);
    },
    clear() {
      sqlite.exec('DELETE FROM temp.survey_stage');
    },
  };
}
