import { useState, type FormEvent } from 'react';
import { toast } from 'sonner';
import type { Role } from '@shared/schemas/common';
import { InviteBodySchema } from '@shared/schemas/members';
import { Button } from '@/components/ui/button';
import { Field, FormAlert, Select, TextInput } from '@/components/ui/field';
import { describeError, useFieldErrors } from '@/components/ui/form-errors';
import { Card, PageHeader } from '@/components/ui/page';
import { useMembers } from '@/features/members/api/get-members';
import { useChangeRole, useInvite, useRemoveMember, useRevokeInvitation } from '@/features/members/api/manage-members';
import { fmtDate } from '@/lib/format';
import { useAgency } from '../use-agency';

const ROLES: Role[] = ['admin', 'engineer', 'viewer'];
const ROLE_NAMES: Record<Role, string> = { admin: 'Admin', engineer: 'Engineer', viewer: 'Viewer' };
const LABELS = { email: 'E-mail', role: 'Role' };
const ROLE_HELP: Record<Role, string> = {
  admin: 'An admin runs the agency: members, settings, the catalog and its prices, and everything an engineer does.',
  engineer:
    'An engineer keeps the inventory, imports, surveys and treatments, compares alternatives, and builds and publishes plans.',
  viewer: 'A viewer reads published plans, their briefs, and the inventory and its map.',
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
  const f = useFieldErrors(LABELS);
  const onError = (e: Error) => toast.error(describeError(e, LABELS));
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const body = f.check(InviteBodySchema, { email, role });
    if (!body) return;
    invite.mutate(body, {
      onSuccess: () => {
        toast.success(`Invitation sent to ${body.email}`);
        setEmail('');
      },
      onError: f.fromError,
    });
  };
  return (
    <div className="space-y-5">
      <PageHeader title="Members" caption="People with access to this agency, and their roles." />
      <Card title="Invite someone">
        <form onSubmit={submit} noValidate className="flex flex-wrap items-start gap-3" aria-label="Invite someone">
          <div className="w-72">
            <Field label={LABELS.email} error={f.error('email')}>
              <TextInput
                type="email"
                value={email}
                onChange={(e) => {
                  setEmail(e.target.value);
                  f.clear('email');
                }}
              />
            </Field>
          </div>
          <div className="w-40">
            <Field label={LABELS.role} error={f.error('role')}>
              <Select value={role} onChange={(e) => setRole(e.target.value as Role)}>
                {ROLES.map((r) => (
                  <option key={r} value={r}>
                    {ROLE_NAMES[r]}
                  </option>
                ))}
              </Select>
            </Field>
          </div>
          <Button type="submit" className="mt-6" disabled={invite.isPending}>
            Send invitation
          </Button>
          <div className="w-full">
            <FormAlert messages={f.others} />
          </div>
          <p className="w-full text-xs text-asphalt-muted">
            {ROLE_HELP[role]} The invitation link is valid for seven days.
          </p>
        </form>
      </Card>
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
            {members.data?.members.map((m) => (
              <tr key={m.userId} className="border-t border-asphalt-line/60">
                <td className="py-1.5 pr-3">{m.name}</td>
                <td className="pr-3">{m.email}</td>
                <td className="pr-3">
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
                        {ROLE_NAMES[r]}
                      </option>
                    ))}
                  </Select>
                </td>
                <td className="num pr-3">{fmtDate(m.since)}</td>
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
    </div>
  );
}
