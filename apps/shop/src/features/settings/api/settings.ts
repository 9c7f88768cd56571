import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { SettingsView, UpdateSettingsBody } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

export const getSettings = async () => (await api<{ settings: SettingsView }>('/settings')).settings;
export const settingsQueryOptions = () => queryOptions({ queryKey: ['settings'], queryFn: getSettings });
export const useSettings = () => useQuery(settingsQueryOptions());

export const updateSettings = async (body: UpdateSettingsBody) =>
  (await api<{ settings: SettingsView }>('/settings', { method: 'PATCH', body })).settings;
export function useUpdateSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateSettings,
    onSuccess: (s) => {
      qc.setQueryData(settingsQueryOptions().queryKey, s);
      // stage names show on the board, the job page and the traveller
      void qc.invalidateQueries({ queryKey: ['stages'] });
    },
  });
}

export const uploadLogo = async (file: File) => {
  const body = new FormData();
  body.append('file', file);
  return (await api<{ settings: SettingsView }>('/settings/logo', { body })).settings;
};
export function useUploadLogo() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: uploadLogo,
    onSuccess: (s) => qc.setQueryData(settingsQueryOptions().queryKey, s),
  });
}
