// STAND-IN until the build job lands (issue 14, h-build): run the registered steps for one version right away, in
// this process, and turn it ready with its manifest in one update. The job's runner replaces this; drop the file and
// its one call in publishVersion then.
import { Brand, GuidelineVersion } from '@db/models';
import { log } from '@/lib/log.server';
import type { BuildStep, Manifest } from './contract';
import { BUILD_STEPS } from './steps/index.server';
import { createBuildWriter } from './writer.server';

/** Build version `versionId` now; a failure leaves it `failed` with the reason and is thrown. */
export async function buildNow(versionId: string): Promise<void> {
  const version = await GuidelineVersion.findByPk(versionId, { attributes: ['id', 'brandId', 'number'] });
  if (!version) throw new Error('No such version.');
  const brand = await Brand.findByPk(version.brandId, { attributes: ['id', 'slug'] });
  const writer = createBuildWriter(version.brandId, version.id);
  const steps: BuildStep[] = BUILD_STEPS.map((s) => ({ id: s.id, label: s.label, state: 'waiting' }));
  try {
    for (const [i, step] of BUILD_STEPS.entries()) {
      steps[i] = { ...steps[i], state: 'running', startedAt: new Date().toISOString() };
      await step.run({ versionId, brandId: version.brandId, slug: brand!.slug, number: version.number, writer, progress: async (count) => void (steps[i].count = count) });
      steps[i] = { ...steps[i], state: 'done', finishedAt: new Date().toISOString() };
    }
  } catch (err) {
    const failedAt = steps.findIndex((s) => s.state === 'running');
    if (failedAt >= 0) steps[failedAt] = { ...steps[failedAt], state: 'failed', finishedAt: new Date().toISOString() };
    const reason = `${failedAt >= 0 ? `${steps[failedAt].label}: ` : ''}${(err as Error).message}`;
    log.error({ err, versionId }, 'build: failed');
    await GuidelineVersion.update({ state: 'failed', buildError: reason, buildSteps: steps }, { where: { id: versionId, state: 'building' } });
    throw err;
  }
  const builtAt = new Date();
  const manifest: Manifest = { format: 1, versionId, builtAt: builtAt.toISOString(), entries: writer.entries };
  await GuidelineVersion.update({ state: 'ready', manifest: manifest as GuidelineVersion['manifest'], builtAt, buildSteps: steps, buildError: null }, { where: { id: versionId, state: 'building' } });
}
