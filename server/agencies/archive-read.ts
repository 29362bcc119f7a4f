// Opening an agency archive: unzipped under a hard byte cap (per file and in all),
// the manifest checked against its schema, every file against its hash.
import {
  type ArchiveFile,
  ARCHIVE_ENTRY_BYTES,
  ARCHIVE_FILES,
  OPTIONAL_ARCHIVE_FILES,
  type OptionalArchiveFile,
  type Manifest,
  ManifestSchema,
  MAX_ARCHIVE_EXPANDED_BYTES,
} from './archive-schemas';
import { HttpError } from '../http/errors';
import { boundedUnzip } from '../imports/bounded-unzip';
import { refuseDeclaredOver } from '../imports/read-file';
import { sha256 } from './agency-export';

export type ArchiveIssue = { path: string; message: string };

export function badArchive(issues: ArchiveIssue[]) {
  const shown = issues.slice(0, 20);
  return new HttpError(
    400,
    'bad_archive',
    `The archive was refused; nothing was restored. ${shown.map((i) => `${i.path}: ${i.message}`).join('; ')}${issues.length > shown.length ? `; and ${issues.length - shown.length} more` : ''}`,
    shown,
  );
}

const one = (path: string, message: string) => badArchive([{ path, message }]);

export type ArchiveText = {
  manifest: Manifest;
  files: Record<ArchiveFile, string> & Partial<Record<OptionalArchiveFile, string>>;
};

const WANTED = new Set<string>(['manifest.json', ...ARCHIVE_FILES, ...OPTIONAL_ARCHIVE_FILES]);

export async function readArchive(buf: Buffer): Promise<ArchiveText> {
  await refuseDeclaredOver(buf, {
    maxBytes: MAX_ARCHIVE_EXPANDED_BYTES,
    what: 'The archive',
    advice: 'it is not an export Wearcourse made.',
    notAZip: 'This file is not a Wearcourse agency export (not a zip).',
  });
  const parts = await boundedUnzip(buf, {
    maxBytes: MAX_ARCHIVE_EXPANDED_BYTES,
    what: 'The archive',
    want: (n) => WANTED.has(n),
    maxEntryBytes: (n) => ARCHIVE_ENTRY_BYTES[n as ArchiveFile] ?? 0,
  });
  const text = (n: string) => {
    const b = parts.get(n);
    if (!b) throw one(n, 'is missing from the archive');
    return b.toString('utf8');
  };
  const manifestText = text('manifest.json');
  let raw: unknown;
  try {
    raw = JSON.parse(manifestText);
  } catch {
    throw one('manifest.json', 'is not valid JSON');
  }
  const parsed = ManifestSchema.safeParse(raw);
  if (!parsed.success)
    throw badArchive(
      parsed.error.issues.map((i) => ({ path: ['manifest.json', ...i.path].join('.'), message: i.message })),
    );
  const files = {} as ArchiveText['files'];
  for (const n of ARCHIVE_FILES) {
    files[n] = text(n);
    if (sha256(files[n]) !== parsed.data.files[n])
      throw one(n, 'does not match its hash in the manifest; the archive is damaged or was edited');
  }
  for (const n of OPTIONAL_ARCHIVE_FILES) {
    const hash = parsed.data.files[n];
    if (hash === undefined) continue;
    files[n] = text(n);
    if (sha256(files[n]) !== hash)
      throw one(n, 'does not match its hash in the manifest; the archive is damaged or was edited');
  }
  return { manifest: parsed.data, files };
}
