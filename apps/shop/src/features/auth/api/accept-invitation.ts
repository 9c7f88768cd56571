import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationBody, User } from '@benchwright/contracts';
import { api } from '@benchwright/ui';
import { meQueryOptions } from '@benchwright/ui/auth';

export const acceptInvitation = (body: AcceptInvitationBody) =>
  api<{ user: User }>('/auth/accept-invitation', { body });
export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: ({ user }) => qc.setQueryData(meQueryOptions().queryKey, user),
  });
}
