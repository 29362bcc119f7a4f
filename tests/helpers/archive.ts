// Agency archives for restore tests: the real export, edited in place with its
// manifest hashes recomputed, as someone crafting a hostile archive would.
import crypto from 'node:crypto';
import JSZip from 'jszip';

export type ArchiveFiles = Record<string, string>;
export type ManifestLike = {
  format: unknown;
  version: unknown;
  agency: { name: unknown; economics: Record<string, unknown> } & Record<string, unknown>;
  files: Record<string, string>;
} & Record<string, unknown>;

const sha256 = (s: string) => crypto.createHash('sha256').update(s).digest('hex');

export async function archiveFiles(buf: Buffer): Promise<ArchiveFiles> {
  const zip = await JSZip.loadAsync(buf);
  const out: ArchiveFiles = {};
  for (const n of Object.keys(zip.files)) out[n] = await zip.file(n)!.async('string');
  return out;
}

/**
 * Applies the edit, re-hashes every file into the manifest (unless `keepHashes`) and zips again.
 * `manifestText` replaces the manifest with raw text; `null` leaves it out.
 */
export async function editedArchive(
  buf: Buffer,
  edit: (files: ArchiveFiles, manifest: ManifestLike) => void,
  opts: { keepHashes?: boolean; manifestText?: string | null } = {},
): Promise<Buffer> {
  const files = await archiveFiles(buf);
  const manifest = JSON.parse(files['manifest.json']) as ManifestLike;
  edit(files, manifest);
  if (!opts.keepHashes)
    for (const n of Object.keys(manifest.files)) if (n in files) manifest.files[n] = sha256(files[n]);
  const zip = new JSZip();
  const manifestText = opts.manifestText === undefined ? JSON.stringify(manifest) : opts.manifestText;
  if (manifestText !== null) zip.file('manifest.json', manifestText);
  for (const [n, text] of Object.entries(files)) if (n !== 'manifest.json') zip.file(n, text);
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
}

/** Edits one feature's properties of segments.geojson. */
export const editFeature =
  (index: number, props: Record<string, unknown>, geometry?: unknown) => (files: ArchiveFiles) => {
    const geo = JSON.parse(files['segments.geojson']);
    Object.assign(geo.features[index].properties, props);
    if (geometry !== undefined) geo.features[index].geometry = geometry;
    files['segments.geojson'] = JSON.stringify(geo);
  };

/** Edits one JSON file with a function of its parsed content. */
export const editJson =
  <T>(name: string, f: (v: T) => unknown) =>
  (files: ArchiveFiles) => {
    files[name] = JSON.stringify(f(JSON.parse(files[name]) as T));
  };
