import { toast } from 'sonner';
import { ROLES, type Role } from '@shared/schemas/common';
import type { MembersResponse } from '@shared/schemas/members';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { Card } from '@/components/ui/page';
import { fmtDate } from '@/lib/format';
import { useChangeRole, useRemoveMember } from '../api/manage-members';
import { ROLE_NAMES } from './role-words';

/** The members with their roles; an admin cannot change or remove themself here. */
export function MemberTable({
  agencyId,
  members,
  myUserId,
  onError,
}: {
  agencyId: string;
  members: MembersResponse | undefined;
  myUserId: string | undefined;
  onError: (e: Error) => void;
}) {
  const changeRole = useChangeRole(agencyId);
  const remove = useRemoveMember(agencyId);
  return (
    <Card title="Members">
      <table className="w-full text-sm">
        <thead className="text-left text-xs font-bold text-asphalt-muted">
          <tr>
            <th className="py-1 pr-3">Name</th>
            <th className="pr-3">E-mail</th>
            <th className="pr-3">Role</th>
            <th className="pr-3">Since</th>
            <th />
          </tr>
        </thead>
        <tbody>
          {members?.members.map((m) => (
            <tr key={m.userId} className="border-t border-asphalt-line/60">
              <td className="py-1.5 pr-3">{m.name}</td>
              <td className="pr-3">{m.email}</td>
              <td className="pr-3">
                <Select
                  aria-label={`Role of ${m.email}`}
                  className="w-32"
                  value={m.role}
                  disabled={m.userId === myUserId}
                  onChange={(e) =>
                    changeRole.mutate(
                      { userId: m.userId, role: e.target.value as Role },
                      { onError, onSuccess: () => toast.success('Role changed') },
                    )
                  }
                >
                  {ROLES.map((r) => (
                    <option key={r} value={r}>
                      {ROLE_NAMES[r]}
                    </option>
                  ))}
                </Select>
              </td>
              <td className="num pr-3">{fmtDate(m.since)}</td>
              <td className="text-right">
                {m.userId !== myUserId && (
                  <Button
                    variant="ghost"
                    onClick={() => {
                      if (confirm(`Remove ${m.email} from this agency?`)) remove.mutate(m.userId, { onError });
                    }}
                  >
                    Remove
                  </Button>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
