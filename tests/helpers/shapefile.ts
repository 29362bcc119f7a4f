// A minimal ESRI shapefile writer (PolyLine, type 3) for tests: .shp, .shx,
// .dbf (dBase III, character fields) and .prj, zipped. Layout per the ESRI
// Shapefile Technical Description (1998): big-endian file header fields,
// little-endian record contents.
import JSZip from 'jszip';

type Line = number[][];

export async function zippedShapefile(features: { props: Record<string, string>; lines: Line[] }[], prjWkt: string) {
  const recs = features.map((f) => {
    const pts = f.lines.flat();
    const size = 44 + 4 * f.lines.length + 16 * pts.length;
    const b = Buffer.alloc(size);
    b.writeInt32LE(3, 0);
    const xs = pts.map((p) => p[0]);
    const ys = pts.map((p) => p[1]);
    for (const [i, v] of [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)].entries())
      b.writeDoubleLE(v, 4 + 8 * i);
    b.writeInt32LE(f.lines.length, 36);
    b.writeInt32LE(pts.length, 40);
    let start = 0;
    f.lines.forEach((l, i) => {
      b.writeInt32LE(start, 44 + 4 * i);
      start += l.length;
    });
    pts.forEach((p, i) => {
      b.writeDoubleLE(p[0], 44 + 4 * f.lines.length + 16 * i);
      b.writeDoubleLE(p[1], 44 + 4 * f.lines.length + 16 * i + 8);
    });
    return b;
  });
  const all = features.flatMap((f) => f.lines.flat());
  const box = [
    Math.min(...all.map((p) => p[0])),
    Math.min(...all.map((p) => p[1])),
    Math.max(...all.map((p) => p[0])),
    Math.max(...all.map((p) => p[1])),
  ];
  const header = (lengthBytes: number) => {
    const h = Buffer.alloc(100);
    h.writeInt32BE(9994, 0);
    h.writeInt32BE(lengthBytes / 2, 24);
    h.writeInt32LE(1000, 28);
    h.writeInt32LE(3, 32);
    for (const [i, v] of box.entries()) h.writeDoubleLE(v, 36 + 8 * i);
    return h;
  };
  const shpParts: Buffer[] = [];
  const shxParts: Buffer[] = [];
  let offset = 100;
  recs.forEach((r, i) => {
    const rh = Buffer.alloc(8);
    rh.writeInt32BE(i + 1, 0);
    rh.writeInt32BE(r.length / 2, 4);
    shpParts.push(rh, r);
    const x = Buffer.alloc(8);
    x.writeInt32BE(offset / 2, 0);
    x.writeInt32BE(r.length / 2, 4);
    shxParts.push(x);
    offset += 8 + r.length;
  });
  const shp = Buffer.concat([header(offset), ...shpParts]);
  const shx = Buffer.concat([header(100 + 8 * recs.length), ...shxParts]);

  const names = Object.keys(features[0].props);
  const width = 40;
  const dh = Buffer.alloc(32);
  dh.writeUInt8(3, 0);
  dh.writeUInt32LE(features.length, 4);
  dh.writeUInt16LE(32 + 32 * names.length + 1, 8);
  dh.writeUInt16LE(1 + width * names.length, 10);
  const fields = names.map((n) => {
    const fd = Buffer.alloc(32);
    fd.write(n.slice(0, 10), 0, 'latin1');
    fd.write('C', 11, 'latin1');
    fd.writeUInt8(width, 16);
    return fd;
  });
  const rows = features.map((f) =>
    Buffer.from(
      ` ${names
        .map((n) =>
          String(f.props[n] ?? '')
            .padEnd(width)
            .slice(0, width),
        )
        .join('')}`,
      'latin1',
    ),
  );
  const dbf = Buffer.concat([dh, ...fields, Buffer.from([0x0d]), ...rows, Buffer.from([0x1a])]);

  const zip = new JSZip();
  zip.file('roads.shp', shp);
  zip.file('roads.shx', shx);
  zip.file('roads.dbf', dbf);
  zip.file('roads.prj', prjWkt);
  return zip.generateAsync({ type: 'nodebuffer' });
}
