// The words files use for functional classes and surfaces, matched to ours after
// lower-casing and dropping everything but letters and digits ("Principal Arterial",
// "PRINCIPAL_ARTERIAL" and "principal-arterial" are one key).
import { FUNCTIONAL_CLASSES, SURFACES, type FunctionalClass, type Surface } from '../../shared/schemas/segments';

export const valueKey = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');
const key = valueKey;

export const CLASS_ALIASES: Record<string, FunctionalClass> = {
  ...Object.fromEntries(FUNCTIONAL_CLASSES.map((c) => [key(c), c])),
  interstatehighway: 'interstate',
  otherfreewayorexpressway: 'freeway',
  otherfreewaysandexpressways: 'freeway',
  freewayexpressway: 'freeway',
  expressway: 'freeway',
  otherprincipalarterial: 'principal_arterial',
  principalarterialother: 'principal_arterial',
  arterial: 'minor_arterial',
  collector: 'major_collector',
  localroad: 'local',
  localstreet: 'local',
  // FHWA numeric codes 1–7
  '1': 'interstate',
  '2': 'freeway',
  '3': 'principal_arterial',
  '4': 'minor_arterial',
  '5': 'major_collector',
  '6': 'minor_collector',
  '7': 'local',
};

export const SURFACE_ALIASES: Record<string, Surface> = {
  ...Object.fromEntries(SURFACES.map((s) => [key(s), s])),
  ac: 'asphalt',
  hma: 'asphalt',
  asphaltconcrete: 'asphalt',
  bituminous: 'asphalt',
  blacktop: 'asphalt',
  chipseal: 'chip_seal',
  sealcoat: 'chip_seal',
  bst: 'chip_seal',
  pcc: 'concrete',
  portlandcementconcrete: 'concrete',
  aggregate: 'gravel',
  unpaved: 'gravel',
};
