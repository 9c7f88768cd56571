import { infiniteQueryOptions, useInfiniteQuery, useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@benchwright/ui';

export interface Payment {
  id: string;
  projectId: string;
  clientName: string;
  kind: 'deposit' | 'balance';
  status: 'open' | 'paid' | 'expired' | 'refunded' | 'partially_refunded';
  amountCents: number;
  refundedCents: number;
  stripePaymentIntentId: string | null;
  createdAt: string;
}

/** The latest first, a page at a time (`GET /api/payments?cursor=`). */
export const paymentsQueryOptions = () =>
  infiniteQueryOptions({
    queryKey: ['payments'],
    queryFn: ({ pageParam }) =>
      api<{ payments: Payment[]; nextCursor: string | null }>(
        `/payments${pageParam ? `?cursor=${encodeURIComponent(pageParam)}` : ''}`,
      ),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor ?? null,
  });
/** Polls while a refund is on its way (the card processor confirms it by webhook). */
export const usePayments = (waiting: boolean) =>
  useInfiniteQuery({ ...paymentsQueryOptions(), refetchInterval: waiting ? 1500 : false });

export function useRefund() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, amountCents }: { id: string; amountCents: number }) =>
      api<{ refund: { id: string; amountCents: number; status: string } }>(
        `/payments/${encodeURIComponent(id)}/refund`,
        { body: { amountCents } },
      ),
    onSuccess: () => qc.invalidateQueries({ queryKey: paymentsQueryOptions().queryKey }),
  });
}
