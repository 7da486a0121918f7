import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CalloutDto, CreateCalloutBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const createCallout = ({ photoId, body, headers }: { photoId: number; body: CreateCalloutBody; headers?: Record<string, string> }) =>
  api.post<{ callout: CalloutDto }>(`/api/photos/${photoId}/callouts`, body, { headers });

export function useCreateCallout(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createCallout, onSettled: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
