import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EstimateStatus, LINE_GROUPS } from '@benchwright/contracts';
import type { Drawing } from '@benchwright/pricing/geometry';
import { api } from '@benchwright/ui';

export interface ClientEstimate {
  id: string;
  projectId: string;
  number: string;
  revision: number;
  status: EstimateStatus;
  version: number;
  validUntil: string | null;
  acceptedName: string | null;
  acceptedAt: string | null;
  lines: { id: string; group: (typeof LINE_GROUPS)[number]; description: string; quantity: number; unit: string; unitPriceCents: number; amountCents: number }[];
  totals: { subtotalCents: number; discountCents: number; taxCents: number; totalCents: number; depositCents: number; balanceCents: number };
  drawings: Drawing[];
  checks: { code: string; level: 'error' | 'warning' | 'caution'; message: string }[];
}

export const getEstimate = async (id: string) => (await api<{ estimate: ClientEstimate }>(`/estimates/${encodeURIComponent(id)}`)).estimate;
export const estimateQueryOptions = (id: string) => queryOptions({ queryKey: ['estimates', id], queryFn: () => getEstimate(id) });
export const useEstimate = (id: string | undefined) => useQuery({ ...estimateQueryOptions(id ?? ''), enabled: Boolean(id) });
