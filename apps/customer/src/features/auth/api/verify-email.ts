import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { User } from '@benchwright/contracts';
import { api } from '@benchwright/ui';
import { meQueryOptions } from './get-me';

export const verifyEmail = (token: string) => api<{ user: User }>('/auth/verify-email', { body: { token } });
export function useVerifyEmail() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: verifyEmail, onSuccess: () => qc.invalidateQueries({ queryKey: meQueryOptions().queryKey }) });
}
