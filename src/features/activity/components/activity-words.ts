// The Activity screen's filter choices (recorded entity → words) and its time stamps.
export const ENTITIES: [string, string][] = [
  ['segment', 'Roads and surveys'],
  ['import', 'Imports'],
  ['mix', 'Mixes'],
  ['treatment', 'Catalog treatments'],
  ['agency', 'Agency settings and economics'],
  ['plan', 'Plans'],
  ['analysis', 'Comparisons'],
  ['curve', 'Deterioration curves'],
  ['membership', 'Members'],
  ['invitation', 'Invitations'],
];

/** "2026-12-02 14:05" in the reader's own time zone. */
export const when = (iso: string) => {
  const d = new Date(iso);
  const p = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())} ${p(d.getHours())}:${p(d.getMinutes())}`;
};
