// Told when a version is published, so followers can be e-mailed the note and the what-changed summary.
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/lib/db.server';
import { log } from '@/lib/log.server';
import { sendTemplate, siteLink } from '@/lib/mail/mail.server';

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
