// How catalog values read on screen: money with its unit, percentages as
// percent, a life that follows the mix said so.
import {
  type Applicability,
  COST_BASIS_LABELS,
  type CostItem,
  type Effect,
  type PriceField,
  type PriceValue,
} from '@shared/schemas/catalog';
import { CLASS_LABELS, fmt1, fmtMoney, SURFACE_LABELS } from '@/lib/format';

/** "$0.40 per SY", "8.0 % of the job". */
export function amountText(c: Pick<CostItem, 'basis' | 'amount'>) {
  if (c.basis === 'percent') return `${fmt1(c.amount * 100)} ${COST_BASIS_LABELS.percent}`;
  return `${fmtMoney(c.amount)} ${COST_BASIS_LABELS[c.basis]}`;
}

export const costItemText = (c: CostItem) => `${c.label}: ${amountText(c)}`;

export const lifeText = (years: number | null) => (years === null ? 'by mix and lift' : `${years} yr`);

/** A price-history value as it reads for its field. */
export function priceValueText(field: PriceField, v: PriceValue): string {
  if (Array.isArray(v)) return v.length ? v.map(costItemText).join('; ') : 'no cost items';
  if (field === 'lifeYears') return lifeText(v);
  if (v === null) return '—';
  if (field === 'pricePerTon') return `${fmtMoney(v)}/ton`;
  if (field === 'spreadRateLbPerSyIn') return `${v} lb/SY-in`;
  return `${v} yr`;
}

export function effectText(e: Effect) {
  const change = e.type === 'reset' ? `PCI set to ${e.value}` : `PCI + ${e.value} (capped at 100)`;
  return e.resetsAge ? change : `${change}, age not reset`;
}

export function appliesText(a: Applicability) {
  const since = a.minYearsSinceLast ? `; at least ${a.minYearsSinceLast} yr since the last treatment` : '';
  return `PCI ${a.pciMin}–${a.pciMax}${since}`;
}

export const surfacesText = (a: Applicability) => a.surfaces.map((s) => SURFACE_LABELS[s] ?? s).join(', ');
export const classesText = (a: Applicability) =>
  a.classes.length === Object.keys(CLASS_LABELS).length
    ? 'every class'
    : a.classes.map((c) => CLASS_LABELS[c] ?? c).join(', ');
