import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignInBody, User } from '@benchwright/contracts';
import { api } from '../index';
import { meQueryOptions } from './get-me';

export const signIn = (body: SignInBody) => api<{ user: User }>('/auth/sign-in', { body });
export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: signIn, onSuccess: ({ user }) => qc.setQueryData(meQueryOptions().queryKey, user) });
}
