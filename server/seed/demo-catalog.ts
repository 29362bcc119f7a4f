// The demo catalog for the fictional agencies. Every price, life and effect
// here is invented for the demo scenario (PRODUCT.md) and is shown in the UI
// with a "demo values" tag; none is a reference value.
import type { MixInput, TreatmentInput } from '../../shared/schemas/catalog';
import { FUNCTIONAL_CLASSES } from '../../shared/schemas/segments';

const COLD =
  'Cold-weather paving: follow the agency specification’s minimum air and surface temperatures and compaction window; thin lifts cool faster than thick ones.';

export const DEMO_MIXES: (MixInput & { key: string })[] = [
  { key: 'dense', name: 'Dense-graded 12.5 mm', binderGrade: 'PG 64-22', modifier: 'none', pricePerTon: 74, spreadRateLbPerSyIn: 110, minLiftIn: 1.5, maxLiftIn: 3, refLiftIn: 2, refLifeYears: 12, coldWeatherNote: COLD, priceEffectiveDate: '2026-03-01' },
  { key: 'polymer', name: 'Polymer-modified 12.5 mm', binderGrade: 'PG 70-22', modifier: 'polymer', pricePerTon: 83, spreadRateLbPerSyIn: 110, minLiftIn: 1.5, maxLiftIn: 3, refLiftIn: 2, refLifeYears: 15, coldWeatherNote: COLD, priceEffectiveDate: '2026-03-01' },
  { key: 'rubber', name: 'Rubber-modified, dry process', binderGrade: 'PG 64-22 base', modifier: 'crumb_rubber_dry', pricePerTon: 80, spreadRateLbPerSyIn: 108, minLiftIn: 1, maxLiftIn: 2, refLiftIn: 1.5, refLifeYears: 14, coldWeatherNote: COLD, priceEffectiveDate: '2026-03-01' },
  { key: 'thin', name: 'Thin-lift 9.5 mm', binderGrade: 'PG 64-22', modifier: 'none', pricePerTon: 78, spreadRateLbPerSyIn: 110, minLiftIn: 0.75, maxLiftIn: 1.25, refLiftIn: 1, refLifeYears: 8, coldWeatherNote: COLD, priceEffectiveDate: '2026-03-01' },
];

const ALL = [...FUNCTIONAL_CLASSES];
const paved = ['asphalt', 'chip_seal'] as ('asphalt' | 'chip_seal')[];
const tack = { label: 'Tack coat', basis: 'per_sy' as const, amount: 0.15 };

export const DEMO_TREATMENTS: (Omit<TreatmentInput, 'mixId'> & { mixKey: string | null })[] = [
  { name: 'Crack seal', category: 'preservation', kind: 'crack_seal', mixKey: null, defaultThicknessIn: null, millDepthIn: 0, lifeYears: 3, productionSyPerDay: 15000, costItems: [{ label: 'Crack sealing', basis: 'per_sy', amount: 0.4 }], effect: { type: 'gain', value: 5, resetsAge: false }, applicability: { pciMin: 60, pciMax: 95, surfaces: paved, classes: ALL, minYearsSinceLast: 2 }, priceEffectiveDate: '2026-03-01' },
  { name: 'Chip seal', category: 'preservation', kind: 'chip_seal', mixKey: null, defaultThicknessIn: null, millDepthIn: 0, lifeYears: 6, productionSyPerDay: 20000, costItems: [{ label: 'Chip seal', basis: 'per_sy', amount: 3.1 }], effect: { type: 'reset', value: 85, resetsAge: true }, applicability: { pciMin: 50, pciMax: 85, surfaces: paved, classes: ['major_collector', 'minor_collector', 'local'], minYearsSinceLast: 4 }, priceEffectiveDate: '2026-03-01' },
  { name: 'Micro-surfacing', category: 'preservation', kind: 'micro_surfacing', mixKey: null, defaultThicknessIn: null, millDepthIn: 0, lifeYears: 7, productionSyPerDay: 15000, costItems: [{ label: 'Micro-surfacing', basis: 'per_sy', amount: 4.4 }], effect: { type: 'reset', value: 88, resetsAge: true }, applicability: { pciMin: 55, pciMax: 85, surfaces: ['asphalt'], classes: ALL, minYearsSinceLast: 4 }, priceEffectiveDate: '2026-03-01' },
  { name: 'Thin overlay', category: 'rehabilitation', kind: 'thin_overlay', mixKey: 'thin', defaultThicknessIn: 1, millDepthIn: 0, lifeYears: null, productionSyPerDay: 12000, costItems: [tack], effect: { type: 'reset', value: 95, resetsAge: true }, applicability: { pciMin: 45, pciMax: 75, surfaces: paved, classes: ALL, minYearsSinceLast: 5 }, priceEffectiveDate: '2026-03-01' },
  { name: 'Mill and overlay (2 in)', category: 'rehabilitation', kind: 'mill_and_overlay', mixKey: 'dense', defaultThicknessIn: 2, millDepthIn: 2, lifeYears: null, productionSyPerDay: 8000, costItems: [{ label: 'Milling 2 in', basis: 'per_sy', amount: 2.4 }, tack], effect: { type: 'reset', value: 98, resetsAge: true }, applicability: { pciMin: 30, pciMax: 65, surfaces: ['asphalt'], classes: ALL, minYearsSinceLast: 6 }, priceEffectiveDate: '2026-03-01' },
  { name: 'Structural overlay (3 in)', category: 'rehabilitation', kind: 'structural_overlay', mixKey: 'dense', defaultThicknessIn: 3, millDepthIn: 0, lifeYears: null, productionSyPerDay: 7000, costItems: [tack, { label: 'Patching', basis: 'per_sy', amount: 8 }], effect: { type: 'reset', value: 100, resetsAge: true }, applicability: { pciMin: 20, pciMax: 50, surfaces: ['asphalt'], classes: ALL, minYearsSinceLast: 6 }, priceEffectiveDate: '2026-03-01' },
  { name: 'Reconstruction', category: 'reconstruction', kind: 'reconstruction', mixKey: null, defaultThicknessIn: null, millDepthIn: 0, lifeYears: 25, productionSyPerDay: 2500, costItems: [{ label: 'Full-depth reconstruction', basis: 'per_sy', amount: 46 }], effect: { type: 'reset', value: 100, resetsAge: true }, applicability: { pciMin: 0, pciMax: 30, surfaces: ['asphalt', 'chip_seal', 'concrete', 'gravel', 'other'], classes: ALL, minYearsSinceLast: 0 }, priceEffectiveDate: '2026-03-01' },
];

export const DEMO_ECONOMICS = { mobilizationPerJob: 3500, trafficControlPerDay: 1200, engineeringFraction: 0.08, contingencyFraction: 0.1 };
