// Publishing in tests: a version is built by a job after the publish request answers, so a test that reads the
// published site, its PDFs or its tokens publishes through publishAndWait and reads once the version is ready.
import type { Client, Reply } from './client';

export interface PublishedVersion {
  number: number;
  state: 'building' | 'ready' | 'failed';
  buildError: string | null;
  buildSteps: { id: string; label: string; state: string; count?: number }[];
  [key: string]: unknown;
}

/** Poll the versions list until version `number` has left `building` (ready or failed); its view then. */
export async function waitForBuild(client: Client, brandId: string, number: number, timeoutMs = 240_000): Promise<PublishedVersion> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const r = await client.get<{ versions: PublishedVersion[] }>(`/api/brands/${brandId}/versions`);
    if (r.status !== 200) throw new Error(`listing versions answered ${r.status}: ${JSON.stringify(r.body)}`);
    const version = r.body.versions.find((v) => v.number === number);
    if (!version) throw new Error(`version ${number} is not listed`);
    if (version.state !== 'building') return version;
    if (Date.now() > until) throw new Error(`version ${number} was still building after ${timeoutMs / 1000} s: ${JSON.stringify(version.buildSteps)}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/**
 * Publish the draft and wait until the version is built. Fails the test when publishing is refused or the build
 * fails (unless `allowFailed`); answers the publish reply and the built version.
 */
export async function publishAndWait(client: Client, brandId: string, note: string, opts: { allowFailed?: boolean } = {}): Promise<{ reply: Reply; version: PublishedVersion }> {
  const reply = await client.post(`/api/brands/${brandId}/versions`, { note });
  if (reply.status !== 201) throw new Error(`publishing answered ${reply.status}: ${JSON.stringify(reply.body)}`);
  const version = await waitForBuild(client, brandId, reply.body.version.number);
  if (version.state === 'failed' && !opts.allowFailed) throw new Error(`version ${version.number} failed to build: ${version.buildError}`);
  return { reply, version };
}
