// One file to the shelf with its progress, through the one fetch helper's upload (fetch reports no upload progress).
import { apiUpload } from '@/lib/client/api';

export interface UploadReply {
  assets: { id: string; name: string; duplicate: boolean; sanitised: string[] }[];
  rejected: { filename: string; code: string; message: string }[];
}

/** POST one file to the shelf; `onProgress` gets 0–1 as bytes leave the browser. */
export function uploadFile(path: string, file: File, onProgress: (fraction: number) => void, fields: Record<string, string> = {}): Promise<UploadReply> {
  const form = new FormData();
  form.append('file', file, file.name);
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  return apiUpload<UploadReply>(path, form, onProgress);
}
