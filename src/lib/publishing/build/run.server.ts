// The build job: runs a `building` version's steps in order, records each step's progress for the publishing
// screen, and turns the version `ready` in ONE update that also writes the manifest, only while it is still
// `building`. A throw fails the build naming the step (after pg-boss's retries, or at once when retrying cannot
// help); a killed process leaves the version `building`, and the next worker start queues it again.
import { DATABASE_URL } from 'astro:env/server';
import pg from 'pg';
import type { Transaction } from 'sequelize';
import { Brand, GuidelineVersion } from '@db/models';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { log } from '@/lib/log.server';
import { defineJob, onWorkerStart, sendJob } from '@/lib/queue.server';
import { siteCache } from '@/lib/publishing/site-cache';
import { BuildBlocked, type BuildStep, type BuildStepDefinition, type Manifest } from './contract';
import { BUILD_STEPS } from './steps/index.server';
import { createBuildWriter } from './writer.server';

/** pg-boss's connection for a job sent inside one of our transactions: the job exists only if the transaction commits. */
export function inTransaction(t: Transaction) {
  // The transaction's own pg client (Sequelize keeps it on the transaction), so pg-boss's SQL goes through untouched.
  const client = (t as unknown as { connection: pg.ClientBase }).connection;
  return { executeSql: (text: string, values: unknown[]) => client.query(text, values) };
}

/** Jobs told that a version turned ready (publish notices); registered by their owners, sent with the ready update. */
const afterReady: { send(versionId: string, t: Transaction): Promise<unknown> }[] = [];
export function onVersionReady(hook: (typeof afterReady)[number]): void {
  afterReady.push(hook);
}

/**
 * Hold PostgreSQL's advisory lock for one version's build while `work` runs, on a connection of its own: a killed
 * process's connection closes and the lock goes with it. 'busy' when another live process is building it.
 */
async function withBuildLock<T>(versionId: string, work: () => Promise<T>): Promise<T | 'busy'> {
  const client = new pg.Client({ connectionString: DATABASE_URL, application_name: 'plumbline-build' });
  // A lost connection (the database restarted or went away) is an 'error' event: unheard, it would end the process.
  // The build's own queries fail on their pool and the job retries; the lock went with the connection.
  client.on('error', (err) => log.warn({ err, versionId }, 'build lock connection lost'));
  await client.connect();
  try {
    const { rows } = await client.query<{ got: boolean }>('SELECT pg_try_advisory_lock(hashtext($1)) AS got', [`build:${versionId}`]);
    if (!rows[0]?.got) return 'busy';
    return await work();
  } finally {
    await client.end().catch(() => undefined); // closing the session releases the lock
  }
}

const now = () => new Date().toISOString();
const PROGRESS_EVERY_MS = 400;

/**
 * Build one version if it is still `building`. `finalAttempt`: a failure marks the version failed (otherwise the
 * job throws and pg-boss tries again). Returns the version's state afterwards ('busy': another process holds it).
 */
export async function buildVersion(versionId: string, opts: { steps?: readonly BuildStepDefinition[]; finalAttempt?: boolean } = {}): Promise<GuidelineVersion['state'] | 'busy'> {
  const steps = opts.steps ?? BUILD_STEPS;
  return withBuildLock(versionId, async () => {
    const version = await GuidelineVersion.findByPk(versionId, { attributes: ['id', 'brandId', 'number', 'state'] });
    if (!version || version.state !== 'building') return version?.state ?? 'failed';
    const brand = await Brand.findByPk(version.brandId, { attributes: ['slug'] });
    if (!brand) return 'failed';
    const record: BuildStep[] = steps.map((s) => ({ id: s.id, label: s.label, state: 'waiting' }));
    const save = (extra: Partial<Pick<GuidelineVersion, 'buildError'>> = {}) =>
      GuidelineVersion.update({ buildSteps: record.map((s) => ({ ...s })), ...extra }, { where: { id: versionId, state: 'building' } });
    await save({ buildError: null });
    const writer = createBuildWriter(version.brandId, versionId);
    const started = performance.now();
    for (const [i, step] of steps.entries()) {
      const mine = record[i];
      Object.assign(mine, { state: 'running', startedAt: now(), count: 0 });
      await save();
      let flushed = 0;
      try {
        await step.run({
          versionId,
          brandId: version.brandId,
          slug: brand.slug,
          number: version.number,
          writer,
          progress: async (count) => {
            mine.count = count;
            if (performance.now() - flushed < PROGRESS_EVERY_MS) return;
            flushed = performance.now();
            await save();
          },
          note: (text) => void (mine.note = text),
        });
      } catch (err) {
        const message = String((err as Error)?.message ?? err).slice(0, 800);
        Object.assign(mine, { state: 'failed', finishedAt: now() });
        const reason = `${step.label}: ${message}`;
        if (err instanceof BuildBlocked || opts.finalAttempt !== false) {
          await GuidelineVersion.update({ state: 'failed', buildError: reason, buildSteps: record }, { where: { id: versionId, state: 'building' } });
          log.error({ err, versionId, step: step.id }, 'build: failed');
          siteCache.forget();
          return 'failed';
        }
        await save({ buildError: `${reason} (trying again)` });
        log.warn({ err, versionId, step: step.id }, 'build: step failed; the job will try again');
        throw err;
      }
      Object.assign(mine, { state: 'done', finishedAt: now() });
      await save();
    }
    const builtAt = new Date();
    const manifest: Manifest = { format: 1, versionId, builtAt: builtAt.toISOString(), entries: writer.entries };
    // The one update that makes the version ready; the jobs told about it are sent in the same transaction.
    const turned = await sequelize.transaction(async (t) => {
      const [count] = await GuidelineVersion.update({ state: 'ready', manifest, builtAt, buildSteps: record, buildError: null }, { where: { id: versionId, state: 'building' }, transaction: t });
      if (count === 1) for (const hook of afterReady) await hook.send(versionId, t);
      return count === 1;
    });
    siteCache.forget();
    log.info({ versionId, number: version.number, files: Object.keys(writer.entries).length, ms: Math.round(performance.now() - started) }, 'build: ready');
    return turned ? 'ready' : ((await GuidelineVersion.findByPk(versionId, { attributes: ['state'] }))?.state ?? 'failed');
  });
}

export const buildJob = defineJob<{ versionId: string }>({
  name: 'version-build',
  retryLimit: 2,
  retryDelay: 5,
  // A build still active after this long belonged to a process that died; pg-boss fails it and tries again.
  expireInSeconds: 15 * 60,
  async run({ versionId }, job) {
    await buildVersion(versionId, { finalAttempt: job.retryCount >= job.retryLimit });
  },
});

/**
 * Queue a version's build (inside the publishing transaction when `t` is given). When builds wait in line, the
 * newest publish goes first (pg-boss takes the highest priority first): its designer is watching the screen, and a
 * backlog of older ones drains behind it. Builds queued again after a restart come last.
 */
export const queueBuild = (versionId: string, t?: Transaction, opts: { recovery?: boolean } = {}) =>
  sendJob(buildJob, { versionId }, { ...(t ? { db: inTransaction(t) } : {}), priority: opts.recovery ? 0 : Math.floor((Date.now() - Date.UTC(2026, 0, 1)) / 1000) });

// A process killed mid-build left its versions `building`: each worker start queues them again (the lock and the
// state check make a duplicate job a no-op). Versions published before builds existed are built the same way.
onWorkerStart(async () => {
  const waiting = await GuidelineVersion.findAll({ where: { state: 'building' }, attributes: ['id'], order: [['publishedAt', 'ASC']] });
  for (const v of waiting) await queueBuild(v.id, undefined, { recovery: true });
  if (waiting.length) log.info({ versions: waiting.length }, 'build: queued versions left building');
});

/** Try a failed build again (the publishing screen's retry): back to `building`, steps cleared, queued. */
export async function retryBuild(brandId: string, number: number): Promise<void> {
  const version = await GuidelineVersion.findOne({ where: { brandId, number }, attributes: ['id', 'state'] });
  if (!version) throw new ApiError(404, 'not_found', `Version ${number} was not found.`);
  if (version.state === 'ready') throw new ApiError(409, 'already_built', `Version ${number} is already built and published.`);
  if (version.state === 'building') throw new ApiError(409, 'building', `Version ${number} is being built already.`);
  await sequelize.transaction(async (t) => {
    const [count] = await GuidelineVersion.update({ state: 'building', buildError: null, buildSteps: [] }, { where: { id: version.id, state: 'failed' }, transaction: t });
    if (count === 1) await queueBuild(version.id, t);
  });
}
