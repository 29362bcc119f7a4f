import { type FormEvent, useState } from 'react';
import { toast } from 'sonner';
import { ROLES, type Role } from '@shared/schemas/common';
import { InviteBodySchema } from '@shared/schemas/members';
import { Button } from '@/components/ui/button';
import { Field, FormAlert, Select, TextInput } from '@/components/ui/field';
import { useFieldErrors } from '@/components/ui/form-errors';
import { Card } from '@/components/ui/page';
import { useInvite } from '../api/manage-members';
import { INVITE_LABELS as LABELS, ROLE_HELP, ROLE_NAMES } from './role-words';

export function InviteForm({ agencyId }: { agencyId: string }) {
  const invite = useInvite(agencyId);
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('viewer');
  const f = useFieldErrors(LABELS);
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
  );
}
