// Multipart upload with per-file progress. fetch() reports no upload progress, so this one helper uses XMLHttpRequest;
// everything else goes through api().
import { ApiClientError } from '@/lib/client/api';

export interface UploadReply {
  assets: { id: string; name: string; duplicate: boolean; sanitised: string[] }[];
  rejected: { filename: string; code: string; message: string }[];
}

/** POST one file to the shelf; `onProgress` gets 0–1 as bytes leave the browser. */
export function uploadFile(path: string, file: File, onProgress: (fraction: number) => void, fields: Record<string, string> = {}): Promise<UploadReply> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append('file', file, file.name);
    for (const [k, v] of Object.entries(fields)) form.append(k, v);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', path);
    xhr.withCredentials = true;
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onerror = () => reject(new ApiClientError(0, 'offline', 'Plumbline could not be reached. Check your connection and try again.'));
    xhr.onload = () => {
      let body: { error?: { code: string; message: string }; rejected?: UploadReply['rejected'] } & Partial<UploadReply> = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        // Not JSON: the generic message below.
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as UploadReply);
      reject(ApiClientError.from(xhr.status, body));
    };
    xhr.send(form);
  });
}
