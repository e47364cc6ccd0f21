// Download a bundle zip with progress: the server streams it and sends an estimate of its size up front.
import { ApiClientError } from '@/lib/client/api';

export async function downloadBundle(brandId: string, body: { assetIds?: string[]; allLogos?: boolean }, onProgress: (fraction: number) => void): Promise<void> {
  const response = await fetch(`/api/brands/${brandId}/bundles`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(body),
    credentials: 'same-origin',
  });
  if (!response.ok || !response.body) {
    throw ApiClientError.from(response.status, await response.json().catch(() => undefined));
  }
  const estimate = Number(response.headers.get('x-bundle-estimate-bytes') ?? 0);
  const name = /filename="([^"]+)"/.exec(response.headers.get('content-disposition') ?? '')?.[1] ?? 'assets.zip';
  const reader = response.body.getReader();
  const chunks: Uint8Array[] = [];
  let received = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    chunks.push(value);
    received += value.length;
    // The estimate is the unpacked size; compression makes the zip smaller, so cap below 1 until it ends.
    if (estimate > 0) onProgress(Math.min(0.97, received / estimate));
  }
  onProgress(1);
  const url = URL.createObjectURL(new Blob(chunks as BlobPart[], { type: 'application/zip' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
