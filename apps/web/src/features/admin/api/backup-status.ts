import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BackupStatus } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const backupStatusKey = [...rootKeys.admin, 'backup'] as const;
export const getBackupStatus = () => api.get<BackupStatus>('/api/system/backup');
export const backupStatusQuery = () => queryOptions({ queryKey: backupStatusKey, queryFn: getBackupStatus });
export const useBackupStatus = () => useQuery(backupStatusQuery());
