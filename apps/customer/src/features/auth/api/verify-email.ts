import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { User } from '@benchwright/contracts';
import { api } from '@benchwright/ui';
import { meQueryOptions } from '@benchwright/ui/auth';

export const verifyEmail = (token: string) => api<{ user: User }>('/auth/verify-email', { body: { token } });
export function useVerifyEmail() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: verifyEmail,
    onSuccess: async ({ user }) => {
      const key = meQueryOptions().queryKey;
      // a fetch of /auth/me that started before the verification must not win: stop it, then take the verified user
      await qc.cancelQueries({ queryKey: key });
      // only when the person signed in here is the one just verified (the link may be opened elsewhere)
      qc.setQueryData(key, (old: User | null | undefined) => (old && old.id === user.id ? user : old));
      await qc.invalidateQueries({ queryKey: key });
    },
  });
}
