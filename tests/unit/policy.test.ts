// The policy table against PRODUCT.md's "People and roles" (our own brief; the roles follow common practice
// in agency–client work: the studio owns, the client reviews, partners receive approved files).
import { describe, expect, test } from 'vitest';
import { BRAND_ACTIONS, can, decide, PERMISSIONS } from '@/lib/auth/policy';
import { BRAND_ROLES } from '@/lib/auth/roles';

const expected: Record<string, string[]> = {
  owner: [...BRAND_ACTIONS],
  editor: ['brand.read', 'brand.update', 'members.read', 'draft.read', 'draft.edit', 'draft.comment', 'version.read', 'version.publish', 'asset.readDraft', 'asset.upload', 'asset.approve', 'asset.download'],
  reviewer: ['brand.read', 'draft.read', 'draft.comment', 'review.decide', 'version.read', 'asset.readDraft', 'asset.download'],
  partner: ['brand.read', 'version.read', 'asset.download'],
  viewer: ['brand.read', 'version.read'],
};

describe.each(BRAND_ROLES)('%s', (role) => {
  test.each(BRAND_ACTIONS)(`%s`, (action) => {
    expect(can(role, action)).toBe(expected[role].includes(action));
  });
});

describe('decide', () => {
  test('anonymous is 401 whatever the role would be', () => {
    expect(decide(false, 'owner', 'brand.read')).toEqual({ ok: false, status: 401, code: 'unauthenticated' });
  });
  test('no role on the brand is 404, so a brand’s existence does not leak', () => {
    expect(decide(true, null, 'brand.delete')).toMatchObject({ status: 404 });
  });
  test('a role without the right is 403', () => {
    expect(decide(true, 'viewer', 'draft.read')).toMatchObject({ status: 403 });
  });
  test('only owners manage members, share links, the trail, insights, deletion and the handover invoice', () => {
    for (const action of ['members.manage', 'shareLink.manage', 'audit.read', 'insights.read', 'brand.delete', 'handover.manage'] as const) {
      expect(PERMISSIONS[action]).toEqual(['owner']);
    }
  });
  test('only approved-asset roles download; viewers read but do not download', () => {
    expect(can('viewer', 'asset.download')).toBe(false);
    expect(can('partner', 'asset.download')).toBe(true);
    expect(can('partner', 'asset.readDraft')).toBe(false);
  });
  test('no role, no rights', () => {
    for (const action of BRAND_ACTIONS) expect(can(null, action)).toBe(false);
  });
});
