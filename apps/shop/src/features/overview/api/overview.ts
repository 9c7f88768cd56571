import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@benchwright/ui';

export interface Overview {
  month: string;
  pipeline: Record<string, number>;
  acceptedThisMonth: { count: number; totalCents: number };
  collectedThisMonth: { depositsCents: number; balancesCents: number };
  winRate: { quoted: number; won: number };
  hours: { jobId: string; clientName: string; stage: string; budgetHours: number; usedHours: number }[];
}

export const overviewQueryOptions = () =>
  queryOptions({
    queryKey: ['overview'],
    queryFn: async () => (await api<{ overview: Overview }>('/overview')).overview,
    refetchInterval: 60_000,
  });
export const useOverview = () => useQuery(overviewQueryOptions());
