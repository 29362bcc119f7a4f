import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Field, TextInput } from '@/components/ui/field';
import { useSignIn } from '@/features/auth/api/sign-in';
import { AuthError, AuthFrame } from './auth-frame';

export function SignInPage() {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const signIn = useSignIn();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = params.get('next');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    signIn.mutate(
      { email, password },
      {
        onSuccess: (me) => {
          const first = me.memberships[0];
          // Only follow a local path, never an outside URL.
          if (next?.startsWith('/a/')) navigate(next, { replace: true });
          else navigate(first ? `/a/${first.agencyId}/network` : '/', { replace: true });
        },
      },
    );
  };
  return (
    <AuthFrame title="Sign in">
      <form onSubmit={submit} className="space-y-4">
        <Field label="E-mail">
          <TextInput
            type="email"
            autoComplete="username"
            required
            value={email}
            onChange={(e) => setEmail(e.target.value)}
          />
        </Field>
        <Field label="Password">
          <TextInput
            type="password"
            autoComplete="current-password"
            required
            value={password}
            onChange={(e) => setPassword(e.target.value)}
          />
        </Field>
        <AuthError error={signIn.error} />
        <Button type="submit" className="w-full" disabled={signIn.isPending}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </Button>
        <Link to="/forgot-password" className="block text-center text-sm text-accent hover:underline">
          Forgot your password?
        </Link>
      </form>
    </AuthFrame>
  );
}
