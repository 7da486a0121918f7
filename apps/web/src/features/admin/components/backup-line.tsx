import { Archive } from 'lucide-react';
import { formatDateTime } from '@/lib/format';
import { useBackupStatus } from '../api/backup-status';

const size = (bytes: number) => (bytes >= 1024 * 1024 ? `${(bytes / 1024 / 1024).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} kB`);

/** One line on the admin page: when the last backup was made (`npm run backup` on the server). */
export function BackupLine() {
  const status = useBackupStatus();
  if (status.isPending) return null;
  const last = status.data?.lastBackup ?? null;
  return (
    <p className="mb-4 flex items-center gap-2 text-sm text-graphite-600" data-testid="last-backup">
      <Archive className="size-4 text-graphite-400" aria-hidden />
      {status.isError ? (
        <span>The date of the last backup could not be read.</span>
      ) : last ? (
        <span>
          Last backup:{' '}
          <time dateTime={last.at} className="font-medium text-graphite-900">
            {formatDateTime(last.at)}
          </time>{' '}
          ({last.files} files, {size(last.bytes)}, folder <span className="font-mono text-xs">{last.folder}</span>)
        </span>
      ) : (
        <span>
          No backup yet. Run <code className="font-mono text-xs">npm run backup</code> on the server.
        </span>
      )}
    </p>
  );
}
