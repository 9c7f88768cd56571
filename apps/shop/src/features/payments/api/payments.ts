import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
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

export const paymentsQueryOptions = () =>
  queryOptions({
    queryKey: ['payments'],
    queryFn: async () => (await api<{ payments: Payment[] }>('/payments')).payments,
  });
/** Polls while a refund is on its way (the card processor confirms it by webhook). */
export const usePayments = (waiting: boolean) =>
  useQuery({ ...paymentsQueryOptions(), refetchInterval: waiting ? 1500 : false });

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
