import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Design, QuotePreview } from '@benchwright/contracts';
import { api } from '../api-client';

/** `GET /api/designs/:slug`: the design with the choices the shop's price book offers for each field (no costs). */
export const getDesign = async (slug: string) =>
  (await api<{ design: Design }>(`/designs/${encodeURIComponent(slug)}`)).design;
export const designQueryOptions = (slug: string) =>
  queryOptions({ queryKey: ['designs', slug], queryFn: () => getDesign(slug), staleTime: 5 * 60_000, retry: false });
export const useDesign = (slug: string) => useQuery(designQueryOptions(slug));

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
