// One way to answer with a file: its type and the attachment header, so the
// browser saves it under a name rather than showing it.
import type { Response } from 'express';

export const DOWNLOAD_TYPES = {
  csv: 'text/csv; charset=utf-8',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  pdf: 'application/pdf',
  zip: 'application/zip',
  json: 'application/json; charset=utf-8',
} as const;

export type DownloadType = keyof typeof DOWNLOAD_TYPES;

/** A file name's readable base: "Brannock County" → "brannock-county". */
export const fileSlug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, '-');

/** Sends `body` as the file `<base>.<type>`. */
export function sendDownload(res: Response, base: string, type: DownloadType, body: string | Buffer | Uint8Array) {
  res.setHeader('Content-Type', DOWNLOAD_TYPES[type]);
  res.setHeader('Content-Disposition', `attachment; filename="${base}.${type}"`);
  res.send(typeof body === 'string' || Buffer.isBuffer(body) ? body : Buffer.from(body));
}
