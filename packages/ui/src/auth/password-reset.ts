import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ForgotPasswordBody, ResetPasswordBody, User } from '@benchwright/contracts';
import { api } from '../index';
import { meQueryOptions } from './get-me';

export const forgotPassword = (body: ForgotPasswordBody) => api<{ sent: boolean }>('/auth/forgot-password', { body });
export const resetPassword = (body: ResetPasswordBody) => api<{ user: User }>('/auth/reset-password', { body });
export const useForgotPassword = () => useMutation({ mutationFn: forgotPassword });
export function useResetPassword() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: resetPassword,
    onSuccess: ({ user }) => qc.setQueryData(meQueryOptions().queryKey, user),
  });
}
