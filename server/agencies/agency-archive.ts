// Per-agency export (agency-export.ts) and restore into a new agency
// (agency-restore.ts: read under a byte cap, validated file by file, written in one transaction).
export { ARCHIVE_FORMAT } from './archive-schemas';
export { exportAgency } from './agency-export';
export { type RestoreReport, restoreAgency } from './agency-restore';
