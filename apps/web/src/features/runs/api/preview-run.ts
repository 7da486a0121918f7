import { useMutation } from '@tanstack/react-query';
import { RUN_PREVIEW_BYTES, type RunPreview } from '@splitcase/contracts';
import { api } from '@/lib/api-client';

/** Sends only the first RUN_PREVIEW_BYTES of the file: the preview needs the header and the first rows. */
export function previewRun({ teardownId, file }: { teardownId: number; file: File }): Promise<RunPreview> {
  const form = new FormData();
  form.append('file', file.slice(0, RUN_PREVIEW_BYTES), file.name);
  return api.postForm<RunPreview>(`/api/teardowns/${teardownId}/runs/preview`, form);
}

export const usePreviewRun = () => useMutation({ mutationFn: previewRun });
