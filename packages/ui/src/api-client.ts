import type { ApiIssue, ErrorCode } from '@benchwright/contracts';

/** An error answer of the API, typed; the UI decides what to show. */
export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly issues: ApiIssue[] = [],
  ) {
    super(message);
  }
}

/**
 * fetch against the app's own origin (Vite proxies /api), with the session cookie. A FormData body goes as
 * multipart (the browser sets its boundary); anything else as JSON.
 */
export async function api<T>(
  path: string,
  init: { method?: string; body?: unknown; headers?: Record<string, string> } = {},
): Promise<T> {
  const form = typeof FormData !== 'undefined' && init.body instanceof FormData;
  const headers = {
    ...(init.body === undefined || form ? {} : { 'Content-Type': 'application/json' }),
    ...init.headers,
  };
  const res = await fetch(`/api${path}`, {
    method: init.method ?? (init.body === undefined ? 'GET' : 'POST'),
    credentials: 'include',
    headers: Object.keys(headers).length ? headers : undefined,
    body: init.body === undefined ? undefined : form ? (init.body as FormData) : JSON.stringify(init.body),
  });
  if (res.status === 204) return undefined as T;
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
  return data as T;
}
