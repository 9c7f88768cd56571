import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { Check } from '@benchwright/pricing/geometry';
import { api } from '@benchwright/ui';

export interface QuotePreview {
  budget: { lowCents: number; highCents: number };
  checks: Pick<Check, 'code' | 'level' | 'message'>[];
  items: [{ drawingSvg: string; massKg: number }]; // one piece is sent, so one comes back
  /** the request's shop hours (for the lead time) */
  hours?: number;
}

/** The budget range, checks and drawing for one configured piece; the last good answer stays while the next loads. */
export function usePreview(spec: unknown, quantity: number) {
  return useQuery({
    queryKey: ['quote-preview', spec, quantity],
    queryFn: async () =>
      (await api<{ quote: QuotePreview }>('/quotes/preview', { body: { items: [{ spec, quantity }] } })).quote,
    placeholderData: keepPreviousData,
    retry: false,
    staleTime: 5 * 60_000,
  });
}
