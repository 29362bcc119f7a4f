import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { SurveyBody, TreatmentRecordBody, TreatmentRecordList } from '@shared/schemas/segment-history';
import { api } from '@/lib/api-client';
import { segmentKeys } from './keys';
import { invalidateSegmentViews } from './update-segment';

export const getTreatmentRecords = (agencyId: string, id: number) =>
  api<TreatmentRecordList>(`/api/agencies/${agencyId}/segments/${id}/treatments`);

export const treatmentRecordsQueryOptions = (agencyId: string, id: number) =>
  queryOptions({
    queryKey: segmentKeys.treatments(agencyId, id),
    queryFn: () => getTreatmentRecords(agencyId, id),
  });

export const useTreatmentRecords = (agencyId: string, id: number) =>
  useQuery(treatmentRecordsQueryOptions(agencyId, id));

export function useAddSurvey(agencyId: string, id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SurveyBody) =>
      api(`/api/agencies/${agencyId}/segments/${id}/surveys`, { method: 'POST', json: body }),
    onSuccess: () => invalidateSegmentViews(qc, agencyId),
  });
}

export function useRecordTreatment(agencyId: string, id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: TreatmentRecordBody) =>
      api(`/api/agencies/${agencyId}/segments/${id}/treatments`, { method: 'POST', json: body }),
    onSuccess: () => invalidateSegmentViews(qc, agencyId),
  });
}
