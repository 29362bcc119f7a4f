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
};

const mb = (n: number) => `${Math.round(n / 1024 / 1024)} MB`;

function tooBig(o: UnzipOptions) {
  return new HttpError(
    400,
    'bad_file',
    `${o.what} expands to more than ${mb(o.maxBytes)} when unzipped; it was refused (nothing was read). Split it or save a smaller file.`,
  );
}

/** Entry name → inflated bytes. Throws a 400 for a broken zip or one that inflates past the cap. */
export async function boundedUnzip(buf: Buffer, o: UnzipOptions): Promise<Map<string, Buffer>> {
  const out = new Map<string, Buffer>();
  let left = o.maxBytes;
  let count = 0;
  // Called by but-unzip for deflated entries only (stored ones come back as they are).
  const inflate = async (raw: Uint8Array) => {
    try {
      return await inflateRaw(raw, { maxOutputLength: Math.max(1, left) });
    } catch (err) {
      if ((err as { code?: string }).code === 'ERR_BUFFER_TOO_LARGE') throw tooBig(o);
      throw err;
    }
  };
  try {
    for (const entry of iter(buf, inflate)) {
      if (++count > MAX_ZIP_ENTRIES) throw new HttpError(400, 'bad_file', `${o.what} holds more than 10,000 files.`);
      if (entry.filename.endsWith('/')) continue;
      if (o.want && !o.want(entry.filename)) continue;
      const bytes = await entry.read();
      if (bytes.length > left) throw tooBig(o);
      left -= bytes.length;
      out.set(entry.filename, Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
    }
  } catch (err) {
    if (err instanceof HttpError) throw err;
    throw new HttpError(400, 'bad_file', `${o.what} is not a readable zip file.`);
  }
  return out;
}
