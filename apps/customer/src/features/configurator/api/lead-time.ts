import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { LeadTimeView } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

/** `GET /api/lead-time?hours=N`: when a job of N shop hours could start and finish, from the shop's board. */
export const getLeadTime = async (hours: number) =>
  (await api<{ leadTime: LeadTimeView }>(`/lead-time?hours=${encodeURIComponent(hours)}`)).leadTime;
export const leadTimeQueryOptions = (hours: number) =>
  queryOptions({ queryKey: ['lead-time', hours], queryFn: () => getLeadTime(hours), staleTime: 5 * 60_000 });
export const useLeadTime = (hours: number | undefined) =>
  useQuery({
    ...leadTimeQueryOptions(hours ?? 0),
    enabled: hours !== undefined,
    placeholderData: keepPreviousData,
    retry: false,
  });
