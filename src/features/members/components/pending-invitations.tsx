import type { MembersResponse } from '@shared/schemas/members';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/page';
import { fmtDate } from '@/lib/format';
import { useRevokeInvitation } from '../api/manage-members';
import { ROLE_NAMES } from './role-words';

export function PendingInvitations({
  agencyId,
  members,
  onError,
}: {
  agencyId: string;
  members: MembersResponse | undefined;
  onError: (e: Error) => void;
}) {
  const revoke = useRevokeInvitation(agencyId);
  return (
    <Card title="Pending invitations">
      {members?.invitations.length ? (
        <ul className="divide-y divide-asphalt-line/60 text-sm">
          {members.invitations.map((i) => (
            <li key={i.id} className="flex items-center justify-between py-1.5">
              <span>
                {i.email} · {ROLE_NAMES[i.role]} · expires {fmtDate(i.expiresAt)}
              </span>
              <Button variant="ghost" onClick={() => revoke.mutate(i.id, { onError })}>
                Withdraw
              </Button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-asphalt-muted">No pending invitations.</p>
      )}
    </Card>
  );
}
