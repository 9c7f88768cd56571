import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  ApiIssue,
  ErrorCode,
  ImportPreview,
  PriceBookEntry,
  PriceBookKind,
  PriceBookView,
  PriceItemBody,
  PriceItemPatch,
} from '@benchwright/contracts';
import { api, ApiRequestError } from '@benchwright/ui';

export const getPriceBook = async () => (await api<{ priceBook: PriceBookView }>('/price-book')).priceBook;
export const priceBookQueryOptions = () => queryOptions({ queryKey: ['price-book'], queryFn: getPriceBook });
export const usePriceBook = () => useQuery(priceBookQueryOptions());

/** The kind's CSV file, served by the API (through the dev proxy) as a download. */
export const csvHref = (kind: PriceBookKind) => `/api/price-book/${kind}.csv`;

type Saved = { entry: PriceBookEntry; version: number };
export const addItem = (kind: PriceBookKind, body: PriceItemBody) =>
  api<Saved>(`/price-book/${kind}`, { method: 'POST', body });
export const editItem = (kind: PriceBookKind, id: string, body: PriceItemPatch) =>
  api<Saved>(`/price-book/${kind}/${encodeURIComponent(id)}`, { method: 'PATCH', body });

function useChange<A>(fn: (a: A) => Promise<Saved>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => qc.invalidateQueries({ queryKey: priceBookQueryOptions().queryKey }),
  });
}
export const useAddItem = (kind: PriceBookKind) => useChange((body: PriceItemBody) => addItem(kind, body));
export const useEditItem = (kind: PriceBookKind) =>
  useChange(({ id, body }: { id: string; body: PriceItemPatch }) => editItem(kind, id, body));

/**
 * Sends a CSV file's text as text/csv (the shared `api` helper sends JSON): with `dryRun` the API answers the
 * preview and saves nothing; without, it saves all or nothing.
 */
export async function importCsv(kind: PriceBookKind, text: string, dryRun: boolean) {
  const res = await fetch(`/api/price-book/${kind}/import${dryRun ? '?dryRun=1' : ''}`, {
    method: 'POST',
    credentials: 'include',
    headers: { 'Content-Type': 'text/csv; charset=utf-8' },
    body: text,
  });
  const data = await res.json().catch(() => null);
  if (!res.ok) {
    const e = (data as { error?: { code: ErrorCode; message: string; issues?: ApiIssue[] } } | null)?.error;
    throw new ApiRequestError(
      res.status,
      e?.code ?? 'internal',
      e?.message ?? `The server answered ${res.status}.`,
      e?.issues ?? [],
    );
  }
  return data as { preview: ImportPreview; version?: number };
}
export const usePreviewImport = (kind: PriceBookKind) =>
  useMutation({ mutationFn: (text: string) => importCsv(kind, text, true) });
export function useConfirmImport(kind: PriceBookKind) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (text: string) => importCsv(kind, text, false),
    onSuccess: () => qc.invalidateQueries({ queryKey: priceBookQueryOptions().queryKey }),
  });
}
