// The expiry job: each run retires the approved shelf assets whose expiry day has come and tells the brand's owners,
// once some days before and once on the day. A plain function of the clock, so any queue (or a test) can run it.
import { Op, QueryTypes } from 'sequelize';
import { Asset, AssetExpiryNotice, Brand } from '@db/models';
import { audit } from '@/lib/audit.server';
import { SITE_LOCALE } from '@/lib/format';
import { log } from '@/lib/log.server';
import type { MailOutcome } from '@/lib/mail/mail.server';
import type { TemplateData } from '@/lib/mail/templates';
import { addDays, dayOf, EXPIRY_NOTICE_DAYS, formatDay, noticeDue } from './expiry';

export interface ExpiryDeps {
  /** Send one templated e-mail (the mail module's sendTemplate). */
  send: (to: string, template: string, data: TemplateData, brandId: string) => Promise<MailOutcome>;
  /** An absolute address on the site. */
  link: (path: string) => string;
}

export interface ExpiryOutcome {
  today: string;
  retired: string[];
  notices: { assetId: string; notice: 'ahead' | 'due'; recipients: number }[];
}

/** The brand's owners with their addresses (better-auth owns "user": a plain query, never a model). */
async function ownersOf(brandId: string): Promise<{ name: string; email: string }[]> {
  return Asset.sequelize!.query<{ name: string; email: string }>(
    `SELECT u.name, u.email FROM brand_members m JOIN "user" u ON u.id = m.user_id WHERE m.brand_id = :brandId AND m.role = 'owner' ORDER BY u.email`,
    { replacements: { brandId }, type: QueryTypes.SELECT },
  );
}

/** Retire one approved asset whose day has come; false when another run (or a person) changed it first. */
async function retire(asset: Asset, brand: Brand, today: string): Promise<boolean> {
  return Asset.sequelize!.transaction(async (t) => {
    const [count] = await Asset.update(
      { state: 'retired', stateChangedAt: new Date(), stateChangedById: null },
      { where: { id: asset.id, state: 'approved' }, transaction: t },
    );
    if (count !== 1) return false;
    await audit(
      { actorId: null, action: 'asset.expire', targetType: 'asset', targetId: asset.id, brandId: brand.id, studioId: brand.studioId, details: { name: asset.name, expiresOn: asset.expiresOn, retiredOn: today, before: 'approved' } },
      t,
    );
    return true;
  });
}

/** Send one notice unless it was sent before: the row is claimed first, and given back when no owner could be told. */
async function notify(asset: Asset, brand: Brand, notice: 'ahead' | 'due', retired: boolean, deps: ExpiryDeps): Promise<number | null> {
  const expiresOn = asset.expiresOn!;
  const [claim, created] = await AssetExpiryNotice.findOrCreate({
    where: { assetId: asset.id, notice, expiresOn },
    defaults: { assetId: asset.id, notice, expiresOn, recipients: 0, sentAt: new Date() },
  });
  if (!created) return null;
  const owners = await ownersOf(brand.id);
  const data: TemplateData = {
    brandName: brand.name,
    assetName: asset.name,
    day: formatDay(expiresOn, SITE_LOCALE),
    days: EXPIRY_NOTICE_DAYS,
    ahead: notice === 'ahead',
    due: notice === 'due',
    retired,
    link: deps.link(`/app/brands/${brand.id}/assets?expiry=${notice === 'due' ? 'expired' : 'expiring'}`),
  };
  let told = 0;
  for (const owner of owners) {
    const outcome = await deps.send(owner.email, 'asset-expiry', { ...data, ownerName: owner.name }, brand.id);
    if (outcome.sent) told += 1;
    else log.warn({ assetId: asset.id, notice, problem: outcome.problem }, 'asset expiry: a notice was not sent');
  }
  if (owners.length > 0 && told === 0) {
    await claim.destroy(); // nobody was told: the next run tries again
    return 0;
  }
  await claim.update({ recipients: told });
  return told;
}

/** One run of the expiry job on the calendar day of `now` (UTC). Safe to run often and from several processes at once. */
export async function runAssetExpiry(now: Date, deps: ExpiryDeps): Promise<ExpiryOutcome> {
  const today = dayOf(now);
  const outcome: ExpiryOutcome = { today, retired: [], notices: [] };
  const assets = await Asset.findAll({
    where: { expiresOn: { [Op.ne]: null, [Op.lte]: addDays(today, EXPIRY_NOTICE_DAYS) }, state: { [Op.in]: ['draft', 'approved'] } },
    order: [['expiresOn', 'ASC'], ['id', 'ASC']],
  });
  const brands = new Map((await Brand.findAll({ where: { id: [...new Set(assets.map((a) => a.brandId))] } })).map((b) => [b.id, b]));
  for (const asset of assets) {
    const brand = brands.get(asset.brandId);
    const notice = noticeDue(asset.expiresOn!, today);
    if (!brand || !notice) continue;
    try {
      const retired = notice === 'due' && asset.state === 'approved' && (await retire(asset, brand, today));
      if (retired) outcome.retired.push(asset.id);
      const recipients = await notify(asset, brand, notice, retired, deps);
      if (recipients !== null) outcome.notices.push({ assetId: asset.id, notice, recipients });
    } catch (err) {
      log.error({ err, assetId: asset.id }, 'asset expiry: one asset failed; the rest go on');
    }
  }
  if (outcome.retired.length || outcome.notices.length) log.info({ today, retired: outcome.retired.length, notices: outcome.notices.length }, 'asset expiry: run');
  return outcome;
}
