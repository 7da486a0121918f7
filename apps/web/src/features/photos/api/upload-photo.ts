import type { PhotoDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';

export interface UploadPhotoInput {
  teardownId: number;
  file: File;
  caption?: string;
  layer?: number;
  step?: number;
}

/** One multipart upload with progress; `abort` cancels it. The caller invalidates the teardown scope when done. */
export function uploadPhoto(input: UploadPhotoInput, onProgress: (fraction: number) => void, headers: Record<string, string> = {}) {
  const form = new FormData();
  form.append('file', input.file, input.file.name);
  if (input.caption) form.append('caption', input.caption);
  if (input.layer !== undefined) form.append('layer', String(input.layer));
  if (input.step !== undefined) form.append('step', String(input.step));
  return api.upload<{ photo: PhotoDto }>(`/api/teardowns/${input.teardownId}/photos`, form, onProgress, headers);
}
