import type { Economics } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';
import { useCatalogWrite } from './catalog-write';
import { catalogPath } from './keys';

export const updateEconomics = (agencyId: string, e: Economics) =>
  api<Economics>(`${catalogPath(agencyId)}/economics`, { method: 'PUT', json: e });

export const useUpdateEconomics = (agencyId: string) =>
  useCatalogWrite(agencyId, (e: Economics) => updateEconomics(agencyId, e));
