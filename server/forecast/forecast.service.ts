import { type Curve, type FitPoint, fitCurve } from '../../shared/engine/forecast/curve';
import {
  classGroup,
  DEFAULT_CURVES,
  familyKey,
  MIN_POINTS_TO_FIT,
  treatmentGroup,
} from '../../shared/engine/forecast/families';
import type { Family, FamilyList } from '../../shared/schemas/forecast';
import { recordAudit } from '../audit';
import type { Deps } from '../deps';
import * as repo from './forecast.repo';

export type { Family };

/** Every family's curve: fitted where it has enough surveys, else the default or the agency's own edit. */
export function families(deps: Deps, agencyId: string, withPoints = true): Family[] {
  const rows = repo.surveyPoints(deps.db, agencyId);
  const overrides = repo.overrides(deps.db, agencyId);
  type Group = Pick<Family, 'surface' | 'classGroup' | 'treatmentGroup'> & { segs: Set<number>; pts: FitPoint[] };
  const fams = new Map<string, Group>();
  for (const r of rows) {
    if (r.surface === 'gravel') continue;
    const key = familyKey(r.surface, r.cls, r.lastTreatment);
    let f = fams.get(key);
    if (!f) {
      const group = { classGroup: classGroup(r.cls), treatmentGroup: treatmentGroup(r.lastTreatment) };
      f = { segs: new Set(), pts: [], surface: r.surface, ...group };
      fams.set(key, f);
    }
    f.segs.add(r.ref);
    if (r.date && r.pci !== null && r.lastYear !== null) {
      const year = Number(r.date.slice(0, 4)) + (Number(r.date.slice(5, 7)) - 1) / 12;
      const age = year - (r.lastYear + 0.5);
      // Only surveys since the last treatment describe this family's curve.
      if (age >= 0) f.pts.push({ age: Math.round(age * 100) / 100, pci: r.pci });
    }
  }
  return [...fams.entries()]
    .map(([key, f]): Family => {
      const fit = f.pts.length >= 3 ? fitCurve(f.pts) : null;
      const override = overrides.get(key);
      const fallback = DEFAULT_CURVES[f.surface] ?? DEFAULT_CURVES.other;
      const useFit = !override && fit && f.pts.length >= MIN_POINTS_TO_FIT;
      const curve = override ?? (useFit ? fit!.curve : fallback);
      const source: Family['source'] = override ? 'edited' : useFit ? 'fitted' : 'default';
      return {
        key,
        surface: f.surface,
        classGroup: f.classGroup,
        treatmentGroup: f.treatmentGroup,
        segments: f.segs.size,
        n: f.pts.length,
        curve,
        source,
        rmse: useFit ? fit!.rmse : null,
        fitted: fit ? { curve: fit.curve, rmse: fit.rmse } : null,
        points: withPoints ? f.pts : [],
      };
    })
    .sort((a, b) => b.segments - a.segments);
}

export function setOverride(deps: Deps, agencyId: string, userId: string, key: string, curve: Curve | null) {
  deps.db.transaction((tx) => {
    repo.clearOverride(tx, agencyId, key);
    if (curve) repo.insertOverride(tx, agencyId, key, curve);
    recordAudit(tx, {
      agencyId,
      userId,
      action: curve ? 'forecast.curve.edit' : 'forecast.curve.reset',
      entity: 'curve',
      entityId: key,
      detail: curve,
    });
  });
}

/** Lookup used by plans: the family's curve, or the surface default for a family not seen yet. */
export function curveLookup(fams: Family[]) {
  const m = new Map(fams.map((f) => [f.key, f.curve]));
  return (key: string) => m.get(key) ?? DEFAULT_CURVES[key.split('|')[0]] ?? DEFAULT_CURVES.other;
}

/** The Forecast screen's list: every family, with its survey points unless asked not to. */
export const familyList = (deps: Deps, agencyId: string, withPoints: boolean): FamilyList => ({
  families: families(deps, agencyId, withPoints),
});

/** A hand-set curve for one family, or null to go back to the fit or the default. */
export function setCurve(deps: Deps, agencyId: string, userId: string, key: string, curve: Curve | null) {
  setOverride(deps, agencyId, userId, key, curve);
  return { ok: true as const };
}
