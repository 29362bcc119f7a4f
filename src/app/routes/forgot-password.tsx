import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Field, TextInput } from '@/components/ui/field';
import { useRequestReset } from '@/features/auth/api/password-reset';
import { AuthError, AuthFrame } from './auth-frame';

export function ForgotPasswordPage() {
  const [email, setEmail] = useState('');
  const reset = useRequestReset();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    reset.mutate(email);
  };
  return (
    <AuthFrame title="Reset your password">
      {reset.isSuccess ? (
        <p className="text-sm" role="status">
          If an account exists for <strong>{email}</strong>, a reset link is on its way. It works once, within an hour.
        </p>
      ) : (
        <form onSubmit={submit} className="space-y-4">
          <Field label="E-mail" hint="We send a single-use link that expires after one hour.">
            <TextInput type="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
          </Field>
          <AuthError error={reset.error} />
          <Button type="submit" className="w-full" disabled={reset.isPending}>
            Send reset link
          </Button>
        </form>
      )}
      <Link to="/sign-in" className="mt-4 block text-center text-sm text-accent hover:underline">
        Back to sign in
      </Link>
    </AuthFrame>
  );
}
