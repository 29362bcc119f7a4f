import type { Mix, MixInput } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';
import { useCatalogWrite } from './catalog-write';
import { catalogPath } from './keys';

export const updateMix = (agencyId: string, id: string, input: MixInput) =>
  api<Mix>(`${catalogPath(agencyId)}/mixes/${id}`, { method: 'PUT', json: input });

export const useUpdateMix = (agencyId: string) =>
  useCatalogWrite(agencyId, (v: { id: string; input: MixInput }) => updateMix(agencyId, v.id, v.input));
