import type { Treatment, TreatmentInput } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';
import { useCatalogWrite } from './catalog-write';
import { catalogPath } from './keys';

export const updateTreatment = (agencyId: string, id: string, input: TreatmentInput) =>
  api<Treatment>(`${catalogPath(agencyId)}/treatments/${id}`, { method: 'PUT', json: input });

export const useUpdateTreatment = (agencyId: string) =>
  useCatalogWrite(agencyId, (v: { id: string; input: TreatmentInput }) => updateTreatment(agencyId, v.id, v.input));
