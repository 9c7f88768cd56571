import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConfirmPaymentBody } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

export interface ConfirmedPayment {
  id: string;
  kind: 'deposit' | 'balance';
  status: string;
  amountCents: number;
}

/**
 * On the return from Checkout: asks the server to look the session up with the card processor and record
 * it if paid, so the payment does not wait on (or get lost with) the webhook.
 */
export const confirmPayment = (body: ConfirmPaymentBody) =>
  api<{ payment: ConfirmedPayment }>('/payments/confirm', { body });
export function useConfirmPayment() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: confirmPayment,
    onSettled: () => qc.invalidateQueries({ queryKey: ['projects'] }),
  });
}
