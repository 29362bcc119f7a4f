import { useState, type FormEvent } from 'react';
import { toast } from 'sonner';
import type { Role } from '@shared/schemas/common';
import { Button } from '@/components/ui/button';
import { Field, Select, TextInput } from '@/components/ui/field';
import { Card, PageHeader } from '@/components/ui/page';
import { useMembers } from '@/features/members/api/get-members';
import { useChangeRole, useInvite, useRemoveMember, useRevokeInvitation } from '@/features/members/api/manage-members';
import { fmtDate } from '@/lib/format';
import { useAgency } from '../use-agency';

const ROLES: Role[] = ['admin', 'engineer', 'viewer'];
const ROLE_HELP: Record<Role, string> = {
  admin: 'members, settings, catalog and prices, and everything an engineer does',
  engineer: 'inventory, imports, surveys, alternatives and plans; publishes plans',
  viewer: 'reads published plans, briefs and the inventory map',
};

export function MembersPage() {
  const { agencyId, me } = useAgency();
  const members = useMembers(agencyId);
  const invite = useInvite(agencyId);
  const revoke = useRevokeInvitation(agencyId);
  const changeRole = useChangeRole(agencyId);
  const remove = useRemoveMember(agencyId);
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('viewer');
  const onError = (e: Error) => toast.error(e.message);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    invite.mutate(
      { email, role },
      {
        onSuccess: () => {
          toast.success(`Invitation sent to ${email}`);
          setEmail('');
        },
        onError,
      },
    );
  };
  return (
    <div className="space-y-5">
      <PageHeader title="Members" caption="People with access to this agency, and their roles." />
      <Card title="Invite someone">
        <form onSubmit={submit} className="flex flex-wrap items-end gap-3">
          <div className="w-72">
            <Field label="E-mail">
              <TextInput type="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
            </Field>
          </div>
          <div className="w-40">
            <Field label="Role">
              <Select aria-label="Role" value={role} onChange={(e) => setRole(e.target.value as Role)}>
                {ROLES.map((r) => (
                  <option key={r} value={r}>
                    {r}
                  </option>
                ))}
              </Select>
            </Field>
          </div>
          <Button type="submit" disabled={invite.isPending}>
            Send invitation
          </Button>
          <p className="w-full text-xs text-asphalt-muted">
            A {role} can see and do: {ROLE_HELP[role]}. The link is valid for seven days.
          </p>
        </form>
      </Card>
      <Card title="Members">
        <table className="w-full text-sm">
          <thead className="text-left text-xs uppercase tracking-wide text-asphalt-muted">
            <tr>
              <th className="py-1">Name</th>
              <th>E-mail</th>
              <th>Role</th>
              <th>Since</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {members.data?.members.map((m) => (
              <tr key={m.userId} className="border-t border-asphalt-line/60">
                <td className="py-1.5">{m.name}</td>
                <td>{m.email}</td>
                <td>
                  <Select
                    aria-label={`Role of ${m.email}`}
                    className="w-32"
                    value={m.role}
                    disabled={m.userId === me?.user.id}
                    onChange={(e) =>
                      changeRole.mutate(
                        { userId: m.userId, role: e.target.value as Role },
                        { onError, onSuccess: () => toast.success('Role changed') },
                      )
                    }
                  >
                    {ROLES.map((r) => (
                      <option key={r} value={r}>
                        {r}
                      </option>
                    ))}
                  </Select>
                </td>
                <td className="num">{fmtDate(m.since)}</td>
                <td className="text-right">
                  {m.userId !== me?.user.id && (
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
      <Card title="Pending invitations">
        {members.data?.invitations.length ? (
          <ul className="divide-y divide-asphalt-line/60 text-sm">
            {members.data.invitations.map((i) => (
              <li key={i.id} className="flex items-center justify-between py-1.5">
                <span>
                  {i.email} · {i.role} · expires {fmtDate(i.expiresAt)}
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
    </div>
  );
}
