import {
  infiniteQueryOptions,
  keepPreviousData,
  queryOptions,
  useInfiniteQuery,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
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
  /** the page size; the API's default (50) when absent */
  limit?: number;
}
/** One page of clients; each page follows the last one's cursor. */
export const getClientsPage = async (p: ClientsParams, cursor: string | null) => {
  const qs = new URLSearchParams({
    sort: p.sort,
    order: p.order,
    ...(p.q ? { q: p.q } : {}),
    ...(p.limit ? { limit: String(p.limit) } : {}),
    ...(cursor ? { cursor } : {}),
  });
  return api<{ clients: ClientSummary[]; nextCursor: string | null }>(`/clients?${qs}`);
};
/** Under ['clients'], so whatever invalidates the clients refreshes every page. */
export const clientsQueryOptions = (p: ClientsParams) =>
  infiniteQueryOptions({
    queryKey: ['clients', 'list', p],
    queryFn: ({ pageParam }) => getClientsPage(p, pageParam),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor ?? null,
    placeholderData: keepPreviousData,
  });
export const useClients = (p: ClientsParams) => useInfiniteQuery(clientsQueryOptions(p));

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
