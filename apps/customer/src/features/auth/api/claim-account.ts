import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationBody, User } from '@benchwright/contracts';
import { api } from '@benchwright/ui';
import { meQueryOptions } from '@benchwright/ui/auth';

export const claimAccount = (body: AcceptInvitationBody) => api<{ user: User }>('/auth/accept-invitation', { body });
export function useClaimAccount() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: claimAccount,
    onSuccess: ({ user }) => qc.setQueryData(meQueryOptions().queryKey, user),
  });
}
