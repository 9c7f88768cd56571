import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@benchwright/ui';

export interface FailedMail {
  id: string;
  to: string;
  subject: string;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string;
  createdAt: string;
}

export const failedMailQueryOptions = () =>
  queryOptions({
    queryKey: ['mail', 'failed'],
    queryFn: async () => (await api<{ mails: FailedMail[] }>('/mail/failed')).mails,
    refetchInterval: 10_000,
  });
export const useFailedMail = () => useQuery(failedMailQueryOptions());

export function useRetryMail() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) =>
      api<{ mail: { id: string } }>(`/mail/${encodeURIComponent(id)}/retry`, { method: 'POST', body: {} }),
    // the worker sends within a second or two; look again shortly
    onSuccess: () => setTimeout(() => void qc.invalidateQueries({ queryKey: failedMailQueryOptions().queryKey }), 1500),
  });
}
