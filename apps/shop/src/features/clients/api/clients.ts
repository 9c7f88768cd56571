import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  ClientDetail,
  ClientSort,
  ClientSummary,
  CreateClientBody,
  CreateProjectBody,
  Project,
} from '@benchwright/contracts';
import { api } from '@benchwright/ui';

export interface ClientsParams {
  q: string;
  sort: ClientSort;
  order: 'asc' | 'desc';
}
export const getClients = async (p: ClientsParams) => {
  const qs = new URLSearchParams({ sort: p.sort, order: p.order, limit: '500', ...(p.q ? { q: p.q } : {}) });
  return (await api<{ clients: ClientSummary[] }>(`/clients?${qs}`)).clients;
};
export const clientsQueryOptions = (p: ClientsParams) =>
  queryOptions({ queryKey: ['clients', p], queryFn: () => getClients(p), placeholderData: keepPreviousData });
export const useClients = (p: ClientsParams) => useQuery(clientsQueryOptions(p));

export const getClient = async (id: string) =>
  (await api<{ client: ClientDetail }>(`/clients/${encodeURIComponent(id)}`)).client;
export const clientQueryOptions = (id: string) =>
  queryOptions({ queryKey: ['clients', id], queryFn: () => getClient(id) });
export const useClient = (id: string) => useQuery(clientQueryOptions(id));

export const createClient = async (body: CreateClientBody) =>
  (await api<{ client: ClientDetail }>('/clients', { body })).client;
export function useCreateClient() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createClient, onSuccess: () => qc.invalidateQueries({ queryKey: ['clients'] }) });
}

/** The owner starts a project for a client; one Idempotency-Key per attempt, as the portal's request does. */
export const startProject = async ({ key, ...body }: CreateProjectBody & { key: string }) =>
  (await api<{ project: Project }>('/projects', { body, headers: { 'Idempotency-Key': key } })).project;
export function useStartProject() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: startProject,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: ['clients'] });
      void qc.invalidateQueries({ queryKey: ['projects'] });
    },
  });
}
