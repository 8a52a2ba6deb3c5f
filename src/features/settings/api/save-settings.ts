import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SettingsBody, SettingsView } from '../../../../shared/clinic/settings';
import { apiRequest } from '../../../lib/api-client';
import { settingsKeys } from './get-settings';

export const saveSettings = (body: SettingsBody) => apiRequest<SettingsView>('/api/settings', { method: 'PUT', body });

export function useSaveSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveSettings,
    onSuccess: (view) => {
      queryClient.setQueryData(settingsKeys.detail(), view);
      // The clinic's name shows in the top bar, which reads the signed-in user.
      return queryClient.invalidateQueries({ queryKey: ['auth'] });
    },
  });
}
