// Recording what published sites are read. Called on the hot path of every published read: it must return at once
// and never throw. Reads wait in a bounded buffer in memory; each second (or at 500) the buffer becomes one queued
// job, after the visitor keys are made from the day's salt, so no address or user agent leaves this process.
import { log } from '@/lib/log.server';
import { sendJob } from '@/lib/queue.server';
import type { SiteEvent, SiteRead } from './contract';
import { insightsWriteJob } from './jobs.server';
import { RepeatFilter } from './repeats';
import { clip, utcDay, visitorKey, type InsightKind, type InsightRow } from './rows';
import { saltOf } from './salts.server';

/** Reads or events held at most before new ones are dropped (and counted). */
export const BUFFER_LIMIT = 5000;
/** A batch goes out when this many wait, or after FLUSH_MS. */
export const BATCH_SIZE = 500;
const FLUSH_MS = 1000;

interface Pending {
  at: Date;
  brandId: string;
  versionNumber: number;
  kind: InsightKind;
  path: string | null;
  embedded: boolean;
  shareLinkId: string | null;
  member: boolean;
  ip: string;
  userAgent: string;
  blockId: string | null;
  query: string | null;
  results: number | null;
}

let pending: Pending[] = [];
let timer: NodeJS.Timeout | null = null;
let flushing: Promise<void> = Promise.resolve();
const counters = { recorded: 0, dropped: 0, failed: 0 };

/** How many records this process took, dropped for want of room, and lost when a batch could not be queued. */
export const recorderCounters = () => ({ ...counters, waiting: pending.length });

let lastDropNote = 0;

function push(item: Pending): void {
  if (pending.length >= BUFFER_LIMIT) {
    counters.dropped++;
    // Said at most once a minute: a full buffer means the queue is slower than the site, not that a page should wait.
    if (Date.now() - lastDropNote > 60_000) {
      lastDropNote = Date.now();
      log.warn({ dropped: counters.dropped }, 'insights: buffer full, records dropped');
    }
    return;
  }
  pending.push(item);
  counters.recorded++;
  if (pending.length >= BATCH_SIZE) void flushInsights();
  else timer ??= setTimeout(() => void flushInsights(), FLUSH_MS).unref();
}

/** Sec-Fetch-Dest values of files the page loads by itself (not opened or saved by the visitor). */
const EMBEDDED_DESTS = new Set(['image', 'font', 'style', 'script', 'video', 'audio', 'track', 'object', 'embed']);

/** A repeat of the same read by the same visitor within this long counts once (see repeats.ts). */
export const REPEAT_MS = 30_000;
const repeats = new RepeatFilter(REPEAT_MS, 20_000);

/** Whether this read repeats one noted less than REPEAT_MS ago (and if not, remember it). */
const isRepeat = (read: SiteRead, now: number) =>
  repeats.repeats(`${read.brandId}\n${read.versionNumber}\n${read.path}\n${read.shareLinkId ?? ''}\n${read.userId ?? ''}\n${read.ip}\n${read.userAgent}`, now);

/** Note one read; returns at once. A visitor who asked not to be tracked is not noted at all. */
export function recordRead(read: SiteRead): void {
  try {
    if (read.doNotTrack) return;
    if (isRepeat(read, Date.now())) return;
    push({
      at: new Date(),
      brandId: read.brandId,
      versionNumber: read.versionNumber,
      kind: read.kind,
      path: clip(read.path, 400),
      embedded: read.fetchedAs != null && EMBEDDED_DESTS.has(read.fetchedAs),
      shareLinkId: read.shareLinkId,
      member: read.userId != null,
      ip: read.ip,
      userAgent: clip(read.userAgent, 512),
      blockId: null,
      query: null,
      results: null,
    });
  } catch (err) {
    log.warn({ err }, 'insights: a read was not recorded');
  }
}

/** Note one event the page sent (a section seen, a search); the caller decided access and tracking already. */
export function recordEvent(who: Omit<SiteRead, 'kind' | 'path' | 'doNotTrack' | 'fetchedAs'>, event: SiteEvent): void {
  try {
    push({
      at: new Date(),
      brandId: who.brandId,
      versionNumber: who.versionNumber,
      kind: event.kind,
      path: null,
      embedded: false,
      shareLinkId: who.shareLinkId,
      member: who.userId != null,
      ip: who.ip,
      userAgent: clip(who.userAgent, 512),
      blockId: event.kind === 'section' ? event.blockId : null,
      query: event.kind === 'search' ? event.query.toLowerCase() : null,
      results: event.kind === 'search' ? event.results : null,
    });
  } catch (err) {
    log.warn({ err }, 'insights: an event was not recorded');
  }
}

/** Salted keys for a batch (each record's own UTC day; a day whose salt is gone already uses today's). */
async function toRows(batch: Pending[]): Promise<InsightRow[]> {
  const today = utcDay(new Date());
  const rows: InsightRow[] = [];
  for (const p of batch) {
    const day = utcDay(p.at) < today ? today : utcDay(p.at);
    const salt = await saltOf(day);
    rows.push({
      brandId: p.brandId,
      versionNumber: p.versionNumber,
      kind: p.kind,
      path: p.path,
      embedded: p.embedded,
      shareLinkId: p.shareLinkId,
      member: p.member,
      visitorKey: visitorKey(salt, p.ip, p.userAgent, p.brandId),
      day,
      at: p.at.toISOString(),
      blockId: p.blockId,
      query: p.query,
      results: p.results,
    });
  }
  return rows;
}

/** Hand everything waiting to the queue, one job per batch (tests and shutdown call it to not wait a second). */
export function flushInsights(): Promise<void> {
  if (timer) clearTimeout(timer);
  timer = null;
  flushing = flushing.then(async () => {
    while (pending.length) {
      const batch = pending.slice(0, BATCH_SIZE);
      pending = pending.slice(batch.length);
      try {
        await sendJob(insightsWriteJob, { rows: await toRows(batch) });
      } catch (err) {
        counters.failed += batch.length;
        log.warn({ err, lost: batch.length }, 'insights: a batch could not be queued');
      }
    }
  });
  return flushing;
}
