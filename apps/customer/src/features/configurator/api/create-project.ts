import { useRef } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateProjectBody, Project } from '@benchwright/contracts';
import { api, ApiRequestError } from '@benchwright/ui';

export const createProject = async ({ body, key }: { body: CreateProjectBody; key: string }) =>
  (await api<{ project: Project }>('/projects', { body, headers: { 'Idempotency-Key': key } })).project;

/** A random key; crypto.randomUUID exists only on secure origins, getRandomValues everywhere. */
function newKey(): string {
  const b = crypto.getRandomValues(new Uint8Array(16));
  return Array.from(b, (x) => x.toString(16).padStart(2, '0')).join('');
}

/**
 * Sends the configured piece as a request; the "My projects" list (query key ['projects']) refreshes.
 * Each attempt carries an Idempotency-Key, kept while the same request is sent again (the automatic retries after a
 * dropped connection, or the client pressing the button again after an error), so the shop gets one request however
 * often it is sent; a changed request is a new attempt with a new key.
 */
export function useCreateProject() {
  const qc = useQueryClient();
  const attempt = useRef<{ body: string; key: string } | null>(null);
  const mutation = useMutation({
    mutationFn: createProject,
    // a dropped connection is retried with the same key; an answer of the server is not
    retry: (failures, error) => failures < 2 && !(error instanceof ApiRequestError),
    onSuccess: () => {
      attempt.current = null;
      return qc.invalidateQueries({ queryKey: ['projects'] });
    },
  });
  const send = (body: CreateProjectBody, options?: Parameters<typeof mutation.mutate>[1]) => {
    const json = JSON.stringify(body);
    if (attempt.current?.body !== json) attempt.current = { body: json, key: newKey() };
    mutation.mutate({ body, key: attempt.current.key }, options);
  };
  return { ...mutation, send };
}
