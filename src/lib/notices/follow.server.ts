// Following a brand: members who follow are e-mailed when a new version of its guidelines is published.
import { Brand } from '@db/models';
import { BrandFollow } from '@db/models/collaboration';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';

export async function isFollowing(brand: Brand, userId: string): Promise<boolean> {
  return (await BrandFollow.count({ where: { brandId: brand.id, userId } })) > 0;
}

/** Follow or stop following; repeating either is harmless. */
export async function setFollowing(caller: Caller, brand: Brand, follow: boolean): Promise<{ following: boolean }> {
  await sequelize.transaction(async (t) => {
    const existing = await BrandFollow.findOne({ where: { brandId: brand.id, userId: caller.id }, transaction: t });
    if (follow && !existing) await BrandFollow.create({ brandId: brand.id, userId: caller.id }, { transaction: t });
    if (!follow && existing) await existing.destroy({ transaction: t });
    if (follow !== !!existing) {
      await audit({ actorId: caller.id, action: follow ? 'brand.follow' : 'brand.unfollow', targetType: 'brand', targetId: brand.id, brandId: brand.id, studioId: brand.studioId }, t);
    }
  });
  return { following: follow };
}
