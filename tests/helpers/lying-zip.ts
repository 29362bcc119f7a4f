// Zips whose headers lie about how large their entries are, for the inflation
// tests: each entry can declare a small uncompressed size (1 KB) while its deflate
// stream inflates to far more. Layout per PKWARE's APPNOTE.TXT (local file headers,
// central directory, end of central directory record), all little-endian.
import zlib from 'node:zlib';

export type LyingEntry = { name: string; data: Buffer; declaredSize?: number } | LyingStream;
/** A deflated stream of `realBytes` of one repeated byte, built chunk by chunk so the test never holds it inflated. */
export type LyingStream = { name: string; realBytes: number; fill: number; declaredSize: number };

async function deflated(e: LyingEntry): Promise<{ name: string; raw: Buffer; size: number }> {
  if ('data' in e) return { name: e.name, raw: zlib.deflateRawSync(e.data), size: e.declaredSize ?? e.data.length };
  const chunk = Buffer.alloc(1024 * 1024, e.fill);
  const d = zlib.createDeflateRaw({ level: 9 });
  const parts: Buffer[] = [];
  d.on('data', (c: Buffer) => parts.push(c));
  const done = new Promise<void>((resolve) => d.on('end', resolve));
  for (let left = e.realBytes; left > 0; left -= chunk.length) {
    if (!d.write(left >= chunk.length ? chunk : chunk.subarray(0, left))) await new Promise((r) => d.once('drain', r));
  }
  d.end();
  await done;
  return { name: e.name, raw: Buffer.concat(parts), size: e.declaredSize };
}

export async function lyingZip(entries: LyingEntry[]): Promise<Buffer> {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const e of await Promise.all(entries.map(deflated))) {
    const name = Buffer.from(e.name, 'utf8');
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4); // version needed
    local.writeUInt16LE(8, 8); // deflate
    local.writeUInt32LE(0, 14); // CRC-32 (not checked before inflating)
    local.writeUInt32LE(e.raw.length, 18);
    local.writeUInt32LE(e.size, 22); // the declared, possibly false, size
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(8, 10);
    central.writeUInt32LE(e.raw.length, 20);
    central.writeUInt32LE(e.size, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    locals.push(local, name, e.raw);
    centrals.push(central, name);
    offset += 30 + name.length + e.raw.length;
  }
  const cd = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(cd.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, cd, end]);
}
