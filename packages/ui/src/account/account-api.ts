import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  Account,
  AccountSession,
  ChangeEmailBody,
  ChangePasswordBody,
  UpdateAccountBody,
  User,
} from '@benchwright/contracts';
import { api } from '../api-client';
import { meQueryOptions } from '../auth/get-me';

/** The signed-in person's account: `GET /api/account`. */
export const getAccount = async () => (await api<{ account: Account }>('/account')).account;
export const accountQueryOptions = () => queryOptions({ queryKey: ['account'], queryFn: getAccount });
export const useAccount = () => useQuery(accountQueryOptions());

/** Their signed-in browsers: `GET /api/account/sessions`. */
export const getSessions = async () => (await api<{ sessions: AccountSession[] }>('/account/sessions')).sessions;
export const sessionsQueryOptions = () => queryOptions({ queryKey: ['account', 'sessions'], queryFn: getSessions });
export const useSessions = () => useQuery(sessionsQueryOptions());

/** After a change: the account, and the header's name from `/auth/me`. */
function useAccountChanged() {
  const qc = useQueryClient();
  return (account: Account) => {
    qc.setQueryData(accountQueryOptions().queryKey, account);
    const { pendingEmail: _pending, ...user } = account;
    qc.setQueryData<User | null>(meQueryOptions().queryKey, user);
  };
}

export const renameAccount = (body: UpdateAccountBody) =>
  api<{ account: Account }>('/account', { method: 'PATCH', body });
export function useRenameAccount() {
  const changed = useAccountChanged();
  return useMutation({ mutationFn: renameAccount, onSuccess: ({ account }) => changed(account) });
}

export const changeEmail = (body: ChangeEmailBody) => api<{ account: Account }>('/account/email', { body });
export function useChangeEmail() {
  const changed = useAccountChanged();
  return useMutation({ mutationFn: changeEmail, onSuccess: ({ account }) => changed(account) });
}

export const changePassword = (body: ChangePasswordBody) => api<{ account: Account }>('/account/password', { body });
export function useChangePassword() {
  const qc = useQueryClient();
  const changed = useAccountChanged();
  return useMutation({
    mutationFn: changePassword,
    onSuccess: ({ account }) => {
      changed(account);
      return qc.invalidateQueries({ queryKey: sessionsQueryOptions().queryKey });
    },
  });
}

export const endSession = (id: string) =>
  api<void>(`/account/sessions/${encodeURIComponent(id)}`, { method: 'DELETE' });
export const endOtherSessions = () => api<{ ended: number }>('/account/sessions/end-others', { method: 'POST' });
export function useEndSession() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: endSession,
    onSuccess: () => qc.invalidateQueries({ queryKey: sessionsQueryOptions().queryKey }),
  });
}
export function useEndOtherSessions() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: endOtherSessions,
    onSuccess: () => qc.invalidateQueries({ queryKey: sessionsQueryOptions().queryKey }),
  });
}

/** Following the link mailed to a new address: `POST /api/auth/confirm-email-change`. */
export const confirmEmailChange = (token: string) =>
  api<{ user: User }>('/auth/confirm-email-change', { body: { token } });
export function useConfirmEmailChange() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: confirmEmailChange,
    onSuccess: () =>
      qc.invalidateQueries({ queryKey: ['auth', 'me'] }).then(() => qc.invalidateQueries({ queryKey: ['account'] })),
  });
}
