import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EstimateView } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

export type ClientEstimate = EstimateView;

export const getEstimate = async (id: string) =>
  (await api<{ estimate: ClientEstimate }>(`/estimates/${encodeURIComponent(id)}`)).estimate;
export const estimateQueryOptions = (id: string) =>
  queryOptions({ queryKey: ['estimates', id], queryFn: () => getEstimate(id) });
export const useEstimate = (id: string | undefined) =>
  useQuery({ ...estimateQueryOptions(id ?? ''), enabled: Boolean(id) });
