import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../index';

export const signOut = () => api<void>('/auth/sign-out', { method: 'POST' });
export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: signOut, onSuccess: () => qc.clear() });
}
