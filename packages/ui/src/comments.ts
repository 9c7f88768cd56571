import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CommentBody, Project } from '@benchwright/contracts';
import { api } from './api-client';

/**
 * Adds a comment to a project's timeline (the API mails it to the other
 * side); the project's query (key ['projects', id], in both apps) takes the
 * answer.
 */
export function useComment(projectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CommentBody) =>
      api<{ project: Project }>(`/projects/${encodeURIComponent(projectId)}/comments`, { body }),
    onSuccess: (r) => qc.setQueryData(['projects', projectId], r.project),
  });
}
