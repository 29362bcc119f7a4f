import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const requestReset = (email: string) =>
  api<{ ok: true }>('/api/auth/forgot-password', { method: 'POST', json: { email } });
export const resetPassword = (body: { token: string; password: string }) =>
  api<{ ok: true }>('/api/auth/reset-password', { method: 'POST', json: body });

export const useRequestReset = () => useMutation({ mutationFn: requestReset });
export const useResetPassword = () => useMutation({ mutationFn: resetPassword });
