import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { InvitationBody, User } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

export const getTeam = async () => (await api<{ users: User[] }>('/users')).users;
export const teamQueryOptions = () => queryOptions({ queryKey: ['team'], queryFn: getTeam });
export const useTeam = (enabled = true) => useQuery({ ...teamQueryOptions(), enabled });

export const inviteBuilder = (body: InvitationBody) => api<{ user: User }>('/users/invitations', { body });
export function useInviteBuilder() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: inviteBuilder,
    onSuccess: () => qc.invalidateQueries({ queryKey: teamQueryOptions().queryKey }),
  });
}
