// Guesses which of the file's columns holds each of our fields, from header
// names. A saved mapping for the agency wins where its columns exist.
import { SEGMENT_FIELDS, SURVEY_FIELDS, type SegmentField, type SurveyField } from '../../shared/schemas/imports';

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
    for (const candidate of [norm(field), ...SYNONYMS[field]]) {
      const col = byNorm.get(candidate);
      if (col && !used.has(col)) {
        mapping[field] = col;
        used.add(col);
        break;
      }
    }
  }
  return mapping;
}

/** Units named in the header ("length_km", "Width (m)"), when the user chose none. */
export function unitsFromHeaders(mapping: Record<string, string>) {
  const len = norm(mapping.length_mi ?? '');
  const wid = norm(mapping.width_ft ?? '');
  const metres = /met(re|er)s?$/;
  const length = /(km|kilometres|kilometers)$/.test(len)
    ? 'km'
    : /(ft|feet)$/.test(len)
      ? 'ft'
      : len === 'lengthm' || metres.test(len)
        ? 'm'
        : 'mi';
  const width = wid === 'widthm' || metres.test(wid) ? 'm' : 'ft';
  return { length: length as 'mi' | 'km' | 'ft' | 'm', width: width as 'ft' | 'm' };
}
