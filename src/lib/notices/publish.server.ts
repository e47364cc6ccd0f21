// Told when a version is published and built, so followers can be e-mailed the note and the what-changed summary.
// The e-mails go out from a queue job sent in the same transaction that turns the version ready: never before its
// pages exist, never twice for one version.
import { Op, QueryTypes } from 'sequelize';
import { Brand, GuidelineVersion } from '@db/models';
import { sequelize } from '@/lib/db.server';
import { log } from '@/lib/log.server';
import { sendTemplate, siteLink } from '@/lib/mail/mail.server';
import { changeSummary, compareSnapshots, type Snapshot } from '@/lib/publishing/diff';
import { inTransaction, onVersionReady } from '@/lib/publishing/build/run.server';
import { defineJob, sendJob } from '@/lib/queue.server';

export interface PublishedNotice {
  brandId: string;
  brandName: string;
  slug: string;
  versionNumber: number;
  note: string;
  publishedBy: { id: string; name: string };
  /** Plain-language lines from the what-changed view, e.g. "Colour Roast: #4a2c21 → #512f22". */
  summary: string[];
}

/** Called after the publishing transaction commits: one e-mail per follower who is still a member (never raises). */
export async function notifyPublished(notice: PublishedNotice): Promise<{ notified: string[]; failed: string[] }> {
  const notified: string[] = [];
  const failed: string[] = [];
  try {
    const followers = await sequelize.query<{ email: string; name: string }>(
      `SELECT u.email, u.name FROM brand_follows f
         JOIN brand_members m ON m.brand_id = f.brand_id AND m.user_id = f.user_id
         JOIN "user" u ON u.id = f.user_id
        WHERE f.brand_id = :brandId ORDER BY u.email`,
      { replacements: { brandId: notice.brandId }, type: QueryTypes.SELECT },
    );
    for (const f of followers) {
      const outcome = await sendTemplate(
        f.email,
        'published',
        {
          brandName: notice.brandName,
          versionNumber: notice.versionNumber,
          publisherName: notice.publishedBy.name,
          note: notice.note,
          summary: notice.summary.slice(0, 50),
          link: siteLink(`/b/${notice.slug}`),
          followLink: siteLink(`/app/brands/${notice.brandId}/client#follow`),
        },
        notice.brandId,
      );
      (outcome.sent ? notified : failed).push(f.email);
    }
  } catch (err) {
    log.error({ err }, 'notices: publish notices failed');
  }
  return { notified, failed };
}

/** The notice for a ready version: what changed since the version before it that readers could open. */
async function noticeFor(versionId: string): Promise<PublishedNotice | null> {
  const version = await GuidelineVersion.findByPk(versionId);
  const brand = version && (await Brand.findByPk(version.brandId, { attributes: ['id', 'name', 'slug'] }));
  if (!version || !brand || version.state !== 'ready') return null;
  const previous = await GuidelineVersion.findOne({ where: { brandId: brand.id, state: 'ready', number: { [Op.lt]: version.number } }, order: [['number', 'DESC']], attributes: ['snapshot'] });
  const [publisher] = version.publishedById
    ? await sequelize.query<{ name: string }>('SELECT name FROM "user" WHERE id = :id', { replacements: { id: version.publishedById }, type: QueryTypes.SELECT })
    : [];
  return {
    brandId: brand.id,
    brandName: brand.name,
    slug: brand.slug,
    versionNumber: version.number,
    note: version.note,
    publishedBy: { id: version.publishedById ?? '', name: publisher?.name ?? 'The studio' },
    summary: previous ? changeSummary(compareSnapshots(previous.snapshot as Snapshot, version.snapshot as Snapshot)) : ['First published version'],
  };
}

/** One job per ready version; not retried, so a follower is never e-mailed twice about one version. */
export const publishNoticesJob = defineJob<{ versionId: string }>({
  name: 'publish-notices',
  retryLimit: 0,
  retryDelay: 0,
  expireInSeconds: 10 * 60,
  async run({ versionId }) {
    const notice = await noticeFor(versionId);
    if (notice) await notifyPublished(notice);
  },
});

onVersionReady({ send: (versionId, t) => sendJob(publishNoticesJob, { versionId }, { db: inTransaction(t) }) });
