import { Navigate } from 'react-router-dom';
import { useMe } from '@/features/auth/api/get-me';

export function HomeRedirect() {
  const me = useMe();
  if (me.isLoading) return <div className="p-8 text-sm text-asphalt-muted">Loading…</div>;
  if (!me.data) return <Navigate to="/sign-in" replace />;
  const first = me.data.memberships[0];
  if (!first)
    return (
      <div className="p-8 text-sm">
        You are signed in as {me.data.user.email} but belong to no agency yet. Ask an agency admin for an invitation.
      </div>
    );
  return <Navigate to={`/a/${first.agencyId}/network`} replace />;
}
