import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Field, TextInput } from '@/components/ui/field';
import { useAcceptInvitation, useInvitation } from '@/features/auth/api/invitation';
import { AuthError, AuthFrame } from './auth-frame';

export function InvitePage() {
  const { token = '' } = useParams();
  const info = useInvitation(token);
  const accept = useAcceptInvitation(token);
  const navigate = useNavigate();
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  if (info.isLoading) return <AuthFrame title="Invitation">Loading…</AuthFrame>;
  if (info.error || !info.data)
    return (
      <AuthFrame title="Invitation">
        <p className="text-sm" role="alert">
          {info.error?.message ?? 'This invitation cannot be opened.'}
        </p>
        <Link to="/sign-in" className="mt-4 block text-sm text-accent hover:underline">
          Go to sign in
        </Link>
      </AuthFrame>
    );
  const inv = info.data;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    accept.mutate(inv.hasAccount ? { password } : { name, password }, {
      onSuccess: (me) => {
        const joined = me.memberships.find((m) => m.agencyName === inv.agencyName) ?? me.memberships[0];
        navigate(joined ? `/a/${joined.agencyId}/network` : '/', { replace: true });
      },
    });
  };
  return (
    <AuthFrame title={`Join ${inv.agencyName}`}>
      <p className="mb-4 text-sm text-asphalt-muted">
        Invitation for <strong className="text-asphalt">{inv.email}</strong> as{' '}
        <strong className="text-asphalt">{inv.role}</strong>.
      </p>
      <form onSubmit={submit} className="space-y-4">
        {!inv.hasAccount && (
          <Field label="Your name">
            <TextInput required value={name} onChange={(e) => setName(e.target.value)} />
          </Field>
        )}
        <Field
          label={inv.hasAccount ? 'Your existing password' : 'Choose a password'}
          hint={
            inv.hasAccount ? 'You already have a Wearcourse account; confirm it to join.' : 'At least 10 characters.'
          }
        >
          <TextInput
            type="password"
            required
            minLength={inv.hasAccount ? 1 : 10}
            value={password}
            onChange={(e) => setPassword(e.target.value)}
          />
        </Field>
        <AuthError error={accept.error} />
        <Button type="submit" className="w-full" disabled={accept.isPending}>
          Accept and join
        </Button>
      </form>
    </AuthFrame>
  );
}
