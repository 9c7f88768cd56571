import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { StageKey } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

/** `GET /api/hours-feedback`: per stage, delivered jobs' logged hours against their budgets. */
export interface StageHours {
  stage: StageKey;
  label: string;
  jobs: number;
  ratios: number[];
  medianRatio: number | null;
  suggestedFactor: number | null;
  lastAction: { action: 'applied' | 'dismissed'; at: string } | null;
}

const hoursQueryOptions = () =>
  queryOptions({
    queryKey: ['hours-feedback'],
    queryFn: async () => (await api<{ stages: StageHours[] }>('/hours-feedback')).stages,
  });
export const useHoursFeedback = () => useQuery(hoursQueryOptions());

/** The owner sets a stage's suggestion aside until more jobs are delivered. */
export function useDismissHours() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (stage: StageKey) =>
      api<{ stages: StageHours[] }>(`/hours-feedback/${stage}/dismiss`, { method: 'POST' }),
    onSuccess: (r) => qc.setQueryData(hoursQueryOptions().queryKey, r.stages),
  });
}
