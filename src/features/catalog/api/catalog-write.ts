import { useMutation, useQueryClient } from '@tanstack/react-query';
import { catalogKeys } from './keys';

/** A write to the catalog: on success the catalog and its price history are read again. */
export function useCatalogWrite<V, R>(agencyId: string, write: (v: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: write,
    onSuccess: () => qc.invalidateQueries({ queryKey: catalogKeys.all(agencyId) }),
  });
}
