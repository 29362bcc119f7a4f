// Guesses which of the file's columns holds each of our fields, from header
// names. A saved mapping for the agency wins where its columns exist.
import {
  EXPORT_HEADERS,
  FIELD_LABELS,
  SEGMENT_FIELDS,
  SURVEY_FIELDS,
  type SegmentField,
  type SurveyField,
} from '../../shared/schemas/imports';

type Field = SegmentField | SurveyField;

const norm = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

const SYNONYMS: Record<Field, string[]> = {
  segment_id: [
    'segmentid',
    'segid',
    'id',
    'sectionid',
    'section',
    'segment',
    'segno',
    'segmentno',
    'assetid',
    'roadsegid',
  ],
  road_name: ['roadname', 'road', 'street', 'streetname', 'name', 'route', 'fullname'],
  from_desc: ['fromdesc', 'from', 'fromstreet', 'begin', 'beginsat', 'start', 'fromloc', 'fromlocation'],
  to_desc: ['todesc', 'to', 'tostreet', 'end', 'endsat', 'toloc', 'tolocation'],
  length_mi: ['lengthmi', 'length', 'len', 'lengthmiles', 'miles', 'lengthkm', 'lengthft', 'lengthm', 'km'],
  width_ft: ['widthft', 'width', 'pavementwidth', 'pavewidth', 'widthm'],
  lanes: ['lanes', 'numlanes', 'lanecount', 'nlanes', 'nolanes', 'numberoflanes'],
  functional_class: [
    'functionalclass',
    'funcclass',
    'fclass',
    'class',
    'fc',
    'functionalclassification',
    'roadclass',
    'functional',
    'functiona',
    'funcclas',
  ],
  surface: ['surface', 'surfacetype', 'pavementtype', 'surftype', 'pavetype', 'pavement'],
  adt: ['adt', 'aadt', 'traffic', 'dailytraffic', 'trafficvolume'],
  truck_pct: ['truckpct', 'truckpercent', 'trucks', 'pcttrucks', 'truck', 'trucksharepct', 'heavyvehiclepct'],
  pci: ['pci', 'condition', 'pavementconditionindex', 'pciscore'],
  pci_date: ['pcidate', 'surveydate', 'inspectiondate', 'conditiondate', 'ratingdate', 'date'],
  last_treatment: ['lasttreatment', 'treatment', 'lastwork', 'lastmaintenance'],
  last_treatment_year: [
    'lasttreatmentyear',
    'treatmentyear',
    'yearlasttreated',
    'lastworkyear',
    'yearpaved',
    'lasttreatm',
    'lasttrea1',
    'treatyear',
  ],
  district: ['district', 'zone', 'area', 'maintenancedistrict', 'ward'],
  notes: ['notes', 'comments', 'remarks', 'note'],
  geometry: ['geometry', 'wkt', 'geom', 'thegeom', 'shape', 'geometrywkt'],
  survey_date: ['surveydate', 'date', 'pcidate', 'inspectiondate', 'ratingdate'],
  source: ['source', 'surveysource', 'method', 'rater', 'inspector'],
};

export function fieldsFor(kind: 'segments' | 'surveys'): readonly Field[] {
  return kind === 'segments' ? SEGMENT_FIELDS : SURVEY_FIELDS;
}

// Unit words a header may end with, longest first so "kilometer" is never read as "meter"
// and "mi" never as "m". Every spelling here is tested (tests/api/import-units.test.ts).
export const LENGTH_UNIT_WORDS: [string, 'mi' | 'km' | 'ft' | 'm'][] = [
  ['kilometres', 'km'],
  ['kilometers', 'km'],
  ['kilometre', 'km'],
  ['kilometer', 'km'],
  ['miles', 'mi'],
  ['metres', 'm'],
  ['meters', 'm'],
  ['metre', 'm'],
  ['meter', 'm'],
  ['mile', 'mi'],
  ['feet', 'ft'],
  ['foot', 'ft'],
  ['kms', 'km'],
  ['km', 'km'],
  ['mi', 'mi'],
  ['ft', 'ft'],
  ['m', 'm'],
];
export const WIDTH_UNIT_WORDS = LENGTH_UNIT_WORDS.filter(([, u]) => u === 'ft' || u === 'm') as [string, 'ft' | 'm'][];

const LENGTH_WORDS = /^(segment|seg)?(length|len)(in)?$/;
const WIDTH_WORDS = /^(pavement|pave|surface|road)?(width|wid)(in)?$/;

/** The unit a header names ("length_kilometer" → km), or null when it names none. */
function unitOf<U extends string>(header: string, units: [string, U][], base: RegExp): U | null {
  const h = norm(header);
  for (const [word, unit] of units) {
    if (!h.endsWith(word)) continue;
    const rest = h.slice(0, -word.length);
    // A bare unit ("Miles", "km") or a length/width word before it; nothing else ("lengthnum" is no metre).
    if (rest === '' || base.test(rest)) return unit;
  }
  return null;
}

export function guessMapping(
  columns: string[],
  kind: 'segments' | 'surveys',
  saved: Record<string, string> | null,
): Record<string, string> {
  const mapping: Record<string, string> = {};
  const used = new Set<string>();
  const byNorm = new Map(columns.map((c) => [norm(c), c]));
  for (const field of fieldsFor(kind)) {
    const fromSaved = saved?.[field];
    if (fromSaved && columns.includes(fromSaved) && !used.has(fromSaved)) {
      mapping[field] = fromSaved;
      used.add(fromSaved);
      continue;
    }
    const own = [norm(field), norm(FIELD_LABELS[field])];
    if (field in EXPORT_HEADERS) own.push(norm(EXPORT_HEADERS[field as SegmentField]));
    let col = [...own, ...SYNONYMS[field]].map((c) => byNorm.get(c)).find((c) => c && !used.has(c));
    // "Length (km)", "length_kilometer", "Width in metres"…
    if (!col && field === 'length_mi')
      col = columns.find((c) => !used.has(c) && unitOf(c, LENGTH_UNIT_WORDS, LENGTH_WORDS) !== null);
    if (!col && field === 'width_ft')
      col = columns.find((c) => !used.has(c) && unitOf(c, WIDTH_UNIT_WORDS, WIDTH_WORDS) !== null);
    if (col) {
      mapping[field] = col;
      used.add(col);
    }
  }
  return mapping;
}

/** Units named in the header ("length_km", "Width (m)"), when the user chose none. */
export function unitsFromHeaders(mapping: Record<string, string>) {
  return {
    length: (mapping.length_mi && unitOf(mapping.length_mi, LENGTH_UNIT_WORDS, LENGTH_WORDS)) || 'mi',
    width: (mapping.width_ft && unitOf(mapping.width_ft, WIDTH_UNIT_WORDS, WIDTH_WORDS)) || 'ft',
  } as { length: 'mi' | 'km' | 'ft' | 'm'; width: 'ft' | 'm' };
}
