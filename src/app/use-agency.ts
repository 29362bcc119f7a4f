import { useParams } from 'react-router-dom';
import { useMe } from '@/features/auth/api/get-me';

/** The agency named in the URL and the caller's role in it (null when not a member). */
export function useAgency() {
  const { agencyId = '' } = useParams();
  const me = useMe();
  const membership = me.data?.memberships.find((m) => m.agencyId === agencyId) ?? null;
  return { agencyId, membership, me: me.data ?? null, loading: me.isLoading };
}
