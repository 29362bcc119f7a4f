import type { SurveyInput, TreatmentRecordInput } from '../../shared/schemas/segment-history';
import { TREATMENT_KIND_LABELS } from '../../shared/schemas/catalog';
import { recordAudit } from '../audit';
import type { Db } from '../db/client';
import type { SegmentRow } from '../segments/segments.service';
import type { Deps } from '../deps';
import { HttpError, notFound } from '../http/errors';
import { segmentDetail, segmentRowIn, touchSegment } from '../segments/segments.service';
import * as repo from './segment-history.repo';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

const conflict = (path: string, message: string) =>
  new HttpError(409, 'conflict', `${path} — ${message}`, [{ path: `body.${path}`, message }]);

function segmentOf(tx: Tx, agencyId: string, id: number) {
  const row = segmentRowIn(tx, agencyId, id);
  if (!row) throw notFound('No such segment');
  return row;
}

/** Inserts a survey and, when it is the newest, makes it the segment's latest PCI. */
function addSurveyRow(tx: Tx, agencyId: string, seg: SegmentRow, s: SurveyInput, field: string) {
  const clash = repo.surveyOn(tx, seg.id, s.surveyDate);
  if (clash) throw conflict(field, `${seg.segmentId} already has a survey on ${s.surveyDate}`);
  repo.insertSurvey(tx, {
    agencyId,
    segmentRef: seg.id,
    surveyDate: s.surveyDate,
    pci: s.pci,
    source: s.source ?? null,
  });
  const newest = !seg.pciDate || s.surveyDate >= seg.pciDate;
  if (newest) touchSegment(tx, agencyId, seg.id, { pci: s.pci, pciDate: s.surveyDate });
  return newest;
}

export function addSurvey(deps: Deps, agencyId: string, userId: string, segmentRef: number, input: SurveyInput) {
  deps.db.transaction((tx) => {
    const seg = segmentOf(tx, agencyId, segmentRef);
    const newest = addSurveyRow(tx, agencyId, seg, input, 'surveyDate');
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'survey.add',
      entity: 'segment',
      entityId: seg.segmentId,
      detail: {
        surveyDate: input.surveyDate,
        pci: input.pci,
        source: input.source,
        ...(newest ? { latestPci: { before: seg.pci, after: input.pci } } : {}),
      },
    });
  });
  deps.listCache?.bump(agencyId);
  return segmentDetail(deps, agencyId, segmentRef);
}

/** The words kept in the segment's "last treatment": the kind's name, which forecast families read. */
const lastTreatmentText = (t: { kind: keyof typeof TREATMENT_KIND_LABELS; name: string }) =>
  t.kind === 'custom' ? t.name : TREATMENT_KIND_LABELS[t.kind];

export function recordTreatment(
  deps: Deps,
  agencyId: string,
  userId: string,
  segmentRef: number,
  input: TreatmentRecordInput,
) {
  const id = deps.db.transaction((tx) => {
    const seg = segmentOf(tx, agencyId, segmentRef);
    if (input.treatmentId && !repo.catalogTreatmentOf(tx, agencyId, input.treatmentId))
      throw new HttpError(400, 'bad_request', 'treatmentId — is not in this agency’s catalog', [
        { path: 'body.treatmentId', message: 'is not in this agency’s catalog' },
      ]);
    const row = repo.insertTreatmentRecord(tx, {
      agencyId,
      segmentRef,
      treatedOn: input.treatedOn,
      kind: input.kind,
      name: input.name,
      treatmentId: input.treatmentId,
      mix: input.mix,
      thicknessIn: input.thicknessIn,
      costUsd: input.costUsd,
      notes: input.notes,
      userId,
    });
    const year = Number(input.treatedOn.slice(0, 4));
    const newest = seg.lastTreatmentYear === null || year >= seg.lastTreatmentYear;
    if (newest)
      touchSegment(tx, agencyId, seg.id, { lastTreatment: lastTreatmentText(input), lastTreatmentYear: year });
    if (input.pciAfter !== null)
      addSurveyRow(
        tx,
        agencyId,
        seg,
        { surveyDate: input.treatedOn, pci: input.pciAfter, source: `after ${input.name}` },
        'pciAfter',
      );
    const { pciAfter, treatmentId: _t, ...job } = input;
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'treatment.record',
      entity: 'segment',
      entityId: seg.segmentId,
      detail: {
        ...job,
        ...(pciAfter !== null ? { pciAfter } : {}),
        ...(newest
          ? {
              lastTreatment: { before: seg.lastTreatment, after: lastTreatmentText(input) },
              lastTreatmentYear: { before: seg.lastTreatmentYear, after: year },
            }
          : {}),
      },
    });
    return row.id;
  });
  deps.listCache?.bump(agencyId);
  return repo.treatmentRecordsOf(deps.db, agencyId, segmentRef).find((r) => r.id === id)!;
}

export function treatmentHistory(deps: Deps, agencyId: string, segmentRef: number) {
  if (!segmentRowIn(deps.db, agencyId, segmentRef)) throw notFound('No such segment');
  return { items: repo.treatmentRecordsOf(deps.db, agencyId, segmentRef) };
}
