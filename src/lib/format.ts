const int = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const one = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const two = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });

export const fmtInt = (v: number | null | undefined) => (v === null || v === undefined ? '—' : int.format(v));
export const fmt1 = (v: number | null | undefined) => (v === null || v === undefined ? '—' : one.format(v));
export const fmt2 = (v: number | null | undefined) => (v === null || v === undefined ? '—' : two.format(v));

/** Money: thousands separators, no cents from $1,000 up. */
export function fmtMoney(v: number | null | undefined) {
  if (v === null || v === undefined) return '—';
  return Math.abs(v) >= 1000 ? `$${int.format(v)}` : `$${two.format(v)}`;
}

export const fmtDate = (iso: string | null | undefined) => (iso ? iso.slice(0, 10) : '—');

export const CLASS_LABELS: Record<string, string> = {
  interstate: 'Interstate',
  freeway: 'Freeway / expressway',
  principal_arterial: 'Principal arterial',
  minor_arterial: 'Minor arterial',
  major_collector: 'Major collector',
  minor_collector: 'Minor collector',
  local: 'Local',
};

export const SURFACE_LABELS: Record<string, string> = {
  asphalt: 'Asphalt',
  chip_seal: 'Chip seal',
  concrete: 'Concrete',
  gravel: 'Gravel',
  other: 'Other',
};
