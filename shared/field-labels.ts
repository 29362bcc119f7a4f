// What a person reads for each stored field: in forms, errors, the Activity
// screen and its export. Anything not listed is turned into words by
// `fieldWords` (never shown in camelCase).
export const SEGMENT_FIELD_LABELS: Record<string, string> = {
  segmentId: 'Segment id',
  roadName: 'Road name',
  fromDesc: 'From',
  toDesc: 'To',
  lengthMi: 'Length (mi)',
  widthFt: 'Width (ft)',
  lanes: 'Lanes',
  functionalClass: 'Functional class',
  surface: 'Surface',
  adt: 'ADT (vehicles/day)',
  truckPct: 'Trucks (% of ADT)',
  district: 'District',
  notes: 'Notes',
  pci: 'PCI',
  pciDate: 'PCI date',
  lastTreatment: 'Last treatment',
  lastTreatmentYear: 'Last treatment year',
  geometry: 'Geometry',
};

export const OTHER_FIELD_LABELS: Record<string, string> = {
  // surveys and treatment records
  surveyDate: 'Survey date',
  source: 'Source',
  latestPci: 'Latest PCI',
  treatedOn: 'Date finished',
  kind: 'Kind',
  name: 'Name',
  mix: 'Mix',
  thicknessIn: 'Thickness (in)',
  costUsd: 'Cost ($)',
  pciAfter: 'PCI after the work',
  // mixes
  binderGrade: 'Binder grade',
  modifier: 'Modifier',
  pricePerTon: 'Price ($/ton)',
  spreadRateLbPerSyIn: 'Spread rate (lb/SY/in)',
  minLiftIn: 'Thinnest lift (in)',
  maxLiftIn: 'Thickest lift (in)',
  refLiftIn: 'Reference lift (in)',
  refLifeYears: 'Life at the reference lift (yr)',
  coldWeatherNote: 'Cold-weather note',
  priceEffectiveDate: 'Price effective from',
  // treatments
  category: 'Category',
  mixId: 'Mix',
  defaultThicknessIn: 'Default thickness (in)',
  millDepthIn: 'Milling depth (in)',
  lifeYears: 'Life (yr)',
  productionSyPerDay: 'Production (SY/day)',
  costItems: 'Cost items',
  effect: 'Effect on PCI',
  applicability: 'Where it applies',
  // economics and settings
  discountRate: 'Discount rate',
  discountRateSource: 'Discount rate source',
  analysisPeriodYears: 'Analysis period (yr)',
  baseYear: 'Base year',
  mobilizationPerJob: 'Mobilization ($/job)',
  trafficControlPerDay: 'Traffic control ($/day)',
  engineeringFraction: 'Engineering share',
  contingencyFraction: 'Contingency share',
  units: 'Units',
  // plans
  settings: 'Settings',
  startYear: 'Start year',
  horizonYears: 'Horizon (yr)',
  budgetMode: 'Budget',
  annualBudget: 'Annual budget ($)',
  escalationPct: 'Escalation (%/yr)',
  budgets: 'Budgets by year ($)',
  minNetworkPci: 'Minimum network PCI',
  method: 'Method',
  weighting: 'Benefit weighting',
  treatmentIds: 'Treatments allowed',
  needsWorkBelow: '“Needs work” below PCI',
  // members
  email: 'E-mail',
  role: 'Role',
  // imports
  fileName: 'File',
  added: 'Added',
  updated: 'Updated',
  unchanged: 'Unchanged',
  rejected: 'Rejected',
  // curves
  p0: 'PCI when new',
  a: 'Rate (a)',
  b: 'Shape (b)',
};

export const FIELD_LABELS: Record<string, string> = { ...OTHER_FIELD_LABELS, ...SEGMENT_FIELD_LABELS };

/** `pricePerTon` → "price per ton", `last_treatment` → "last treatment": no code names on screen. */
export const fieldWords = (key: string) =>
  key
    .replace(/[_.]+/g, ' ')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase()
    .trim();

export const fieldLabel = (key: string) => FIELD_LABELS[key] ?? fieldWords(key);
