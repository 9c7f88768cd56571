import { useMutation } from '@tanstack/react-query';
import { api } from '@benchwright/ui';

/** A Checkout Session's address; the browser goes there to pay. */
export const depositCheckout = (estimateId: string) =>
  api<{ url: string }>(`/estimates/${encodeURIComponent(estimateId)}/deposit-checkout`, { method: 'POST' });
export const balanceCheckout = (projectId: string) =>
  api<{ url: string }>(`/projects/${encodeURIComponent(projectId)}/balance-checkout`, { method: 'POST' });
export const useDepositCheckout = () =>
  useMutation({ mutationFn: depositCheckout, onSuccess: ({ url }) => window.location.assign(url) });
export const useBalanceCheckout = () =>
  useMutation({ mutationFn: balanceCheckout, onSuccess: ({ url }) => window.location.assign(url) });
