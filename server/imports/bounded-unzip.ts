// Unzips an uploaded archive (workbook, zipped shapefile, agency export) with a
// hard cap on the bytes produced, whatever the zip's headers declare: each entry
// is inflated by zlib with `maxOutputLength` set to what is left of the budget,
// so a zip that understates its sizes is refused when the cap is reached, not
// after the heap is gone. but-unzip reads the central directory; the inflating
// is ours.
import { promisify } from 'node:util';
import zlib from 'node:zlib';
import { iter } from 'but-unzip';
import { HttpError } from '../http/errors';

const inflateRaw = promisify(zlib.inflateRaw) as (buf: Uint8Array, opts: zlib.ZlibOptions) => Promise<Buffer>;

export const MAX_ZIP_ENTRIES = 10_000;

export type UnzipOptions = {
  /** The most bytes all entries together may inflate to. */
  maxBytes: number;
  /** Which entries to inflate (by name); the others are skipped without inflating. */
  want?: (name: string) => boolean;
  /** How the refusal names the file: "This workbook", "The archive"… */
  what: string;
  /** A lower cap for single entries (by name), e.g. a manifest that must stay small. */
  maxEntryBytes?: (name: string) => number;
};

const mb = (n: number) => `${Math.round(n / 1024 / 1024)} MB`;

function tooBig(o: UnzipOptions, entry?: { name: string; max: number }) {
  return new HttpError(
    400,
    'bad_file',
    entry
      ? `${o.what} was refused (nothing was read): its part ${entry.name.slice(0, 80)} expands to more than ${entry.max < 1024 * 1024 ? `${Math.round(entry.max / 1024)} KB` : mb(entry.max)}.`
      : `${o.what} expands to more than ${mb(o.maxBytes)} when unzipped; it was refused (nothing was read). Split it or save a smaller file.`,
  );
}

/** Entry name → inflated bytes. Throws a 400 for a broken zip or one that inflates past the cap. */
export async function boundedUnzip(buf: Buffer, o: UnzipOptions): Promise<Map<string, Buffer>> {
  const out = new Map<string, Buffer>();
  let left = o.maxBytes;
  let count = 0;
  let entry: { name: string; max: number } | undefined;
  // The budget for the entry being read: what is left in all, or its own cap when lower.
  const budget = () => Math.min(left, entry?.max ?? left);
  // Called by but-unzip for deflated entries only (stored ones come back as they are).
  const inflate = async (raw: Uint8Array) => {
    try {
      return await inflateRaw(raw, { maxOutputLength: Math.max(1, budget()) });
    } catch (err) {
      if ((err as { code?: string }).code === 'ERR_BUFFER_TOO_LARGE')
        throw tooBig(o, entry && entry.max < left ? entry : undefined);
      throw err;
    }
  };
  try {
    for (const item of iter(buf, inflate)) {
      if (++count > MAX_ZIP_ENTRIES) throw new HttpError(400, 'bad_file', `${o.what} holds more than 10,000 files.`);
      if (item.filename.endsWith('/')) continue;
      if (o.want && !o.want(item.filename)) continue;
      entry = o.maxEntryBytes ? { name: item.filename, max: o.maxEntryBytes(item.filename) } : undefined;
      const bytes = await item.read();
      if (bytes.length > budget()) throw tooBig(o, entry && entry.max < left ? entry : undefined);
      left -= bytes.length;
      out.set(item.filename, Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
    }
  } catch (err) {
    if (err instanceof HttpError) throw err;
    throw new HttpError(400, 'bad_file', `${o.what} is not a readable zip file.`);
  }
  return out;
}
