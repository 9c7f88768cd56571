import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignUpBody, User } from '@benchwright/contracts';
import { api } from '@benchwright/ui';
import { meQueryOptions } from '@benchwright/ui/auth';

export const signUp = (body: SignUpBody) => api<{ user: User }>('/auth/sign-up', { body });
export function useSignUp() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: signUp, onSuccess: ({ user }) => qc.setQueryData(meQueryOptions().queryKey, user) });
}
