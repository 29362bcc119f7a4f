import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me, SignInBody } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { meQueryOptions } from './get-me';

export const signIn = (body: SignInBody) => api<Me>('/api/auth/sign-in/email', { method: 'POST', json: body });

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => {
      qc.clear();
      qc.setQueryData(meQueryOptions().queryKey, me);
    },
  });
}
