import { useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Field, TextInput } from '@/components/ui/field';
import { useResetPassword } from '@/features/auth/api/password-reset';
import { AuthError, AuthFrame } from './auth-frame';

export function ResetPasswordPage() {
  const { token = '' } = useParams();
  const [password, setPassword] = useState('');
  const reset = useResetPassword();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    reset.mutate({ token, password });
  };
  return (
    <AuthFrame title="Choose a new password">
      {reset.isSuccess ? (
        <p className="text-sm" role="status">
          Your password is changed and other sessions are signed out.{' '}
          <Link to="/sign-in" className="font-semibold text-accent hover:underline">
            Sign in
          </Link>
        </p>
      ) : (
        <form onSubmit={submit} className="space-y-4">
          <Field label="New password" hint="At least 10 characters; a short sentence works well.">
            <TextInput
              type="password"
              autoComplete="new-password"
              required
              minLength={10}
              value={password}
              onChange={(e) => setPassword(e.target.value)}
            />
          </Field>
          <AuthError error={reset.error} />
          <Button type="submit" className="w-full" disabled={reset.isPending}>
            Set password
          </Button>
        </form>
      )}
    </AuthFrame>
  );
}
