import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SettingsView } from '../../../../shared/clinic/settings';
import { apiRequest } from '../../../lib/api-client';

export const settingsKeys = { all: ['settings'] as const, detail: () => [...settingsKeys.all, 'detail'] as const };

export const getSettings = () => apiRequest<SettingsView>('/api/settings');

export const getSettingsQueryOptions = () => queryOptions({ queryKey: settingsKeys.detail(), queryFn: getSettings });

export const useSettings = () => useQuery(getSettingsQueryOptions());
