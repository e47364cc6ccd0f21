// The set-up decisions of `npm start` and `npm test`, without running apt or PostgreSQL.
import { describe, expect, test } from 'vitest';
import { planInstall, type DebianNeed } from '../../scripts/lib/debian';
import { hbaTrusts, PG_HBA } from '../../scripts/lib/postgres';
import { demoEnabled } from '../../scripts/lib/settings';
import { shareCookieOptions } from '@/lib/publishing/share-cookie';

const need = (pkg: string, present: boolean): DebianNeed => ({ pkg, why: `${pkg} work`, present: () => present });

describe('planInstall: which packages are missing → which apt commands (apt-get(8), debconf(7))', () => {
  test.each([
    ['nothing missing', [need('postgresql', true), need('chromium', true)], true, 'none', []],
    ['nothing missing, not root', [need('postgresql', true), need('chromium', true)], false, 'none', []],
    ['one missing, root', [need('postgresql', true), need('chromium', false)], true, 'install', ['chromium']],
    ['two missing, root: one apt run', [need('postgresql', true), need('chromium', false), need('ghostscript', false)], true, 'install', ['chromium', 'ghostscript']],
    ['missing, not root', [need('postgresql', false), need('chromium', true)], false, 'refuse', ['postgresql']],
    ['the same package twice is asked for once', [need('chromium', false), need('chromium', false)], true, 'install', ['chromium']],
  ])('%s', (_label, needs, asRoot, action, missing) => {
    const plan = planInstall(needs, asRoot);
    expect(plan.action).toBe(action);
    expect(plan.missing).toEqual(missing);
  });

  test('as root: apt-get update, then one non-interactive install without recommends, waiting for apt’s lock', () => {
    const plan = planInstall([need('chromium', false), need('ghostscript', false)], true);
    if (plan.action !== 'install') throw new Error('expected an install plan');
    expect(plan.commands).toHaveLength(2);
    const [update, install] = plan.commands;
    expect(update[0]).toBe('apt-get');
    expect(update.at(-1)).toBe('update');
    expect(install.slice(0, 1)).toEqual(['apt-get']);
    // apt-get(8): -y answers yes; --no-install-recommends keeps to the package's own dependencies.
    expect(install).toEqual(expect.arrayContaining(['install', '-y', '--no-install-recommends', 'chromium', 'ghostscript']));
    // apt.conf(5): DPkg::Lock::Timeout makes apt wait for a lock held by another apt or dpkg.
    expect(install.join(' ')).toMatch(/DPkg::Lock::Timeout=\d+/);
  });

  test('not root: the message names the packages and the command to run', () => {
    const plan = planInstall([need('postgresql', true), need('chromium', false), need('ghostscript', false)], false);
    if (plan.action !== 'refuse') throw new Error('expected a refusal');
    expect(plan.message).toContain('chromium (chromium work)');
    expect(plan.message).toContain('sudo apt-get install -y --no-install-recommends chromium ghostscript');
    expect(plan.message).not.toContain('postgresql');
  });
});

describe('pg_hba.conf: no line lets a connection in without a password (PostgreSQL 15 manual, 21.1 The pg_hba.conf File)', () => {
  test.each([
    ['Debian initdb default with trust', 'local all all trust\nhost all all 127.0.0.1/32 trust\n', true],
    ['peer on the socket', 'local all all peer\n', true],
    ['ident', 'host all all 127.0.0.1/32 ident\n', true],
    ['a commented-out trust line', '# local all all trust\nlocal all all scram-sha-256\n', false],
    ['scram only', 'local all all scram-sha-256\nhost all all 127.0.0.1/32 scram-sha-256\n', false],
  ])('%s → trusts: %s', (_label, hba, trusts) => expect(hbaTrusts(hba)).toBe(trusts));

  test('the file we write asks every connection for a SCRAM password, on socket and 127.0.0.1 only', () => {
    expect(hbaTrusts(PG_HBA)).toBe(false);
    const rules = PG_HBA.split('\n').filter((l) => l.trim() && !l.startsWith('#'));
    expect(rules.every((l) => l.trim().endsWith('scram-sha-256'))).toBe(true);
    expect(rules.filter((l) => l.startsWith('host')).every((l) => l.includes('127.0.0.1/32'))).toBe(true);
  });
});

describe('share cookie attributes (OWASP Session Management Cheat Sheet, Cookies)', () => {
  const now = Date.UTC(2026, 0, 1);
  test.each([
    ['https://guidelines.example', true],
    ['https://guidelines.example:8443/', true],
    ['http://127.0.0.1:4321', false],
  ])('SITE_URL %s → Secure %s', (siteUrl, secure) => {
    const options = shareCookieOptions(siteUrl, null, now);
    expect(options.secure).toBe(secure);
    expect(options).toMatchObject({ httpOnly: true, sameSite: 'lax', path: '/' });
  });
  test('lives until the link expires, at least a minute; 30 days for a link that never does', () => {
    expect(shareCookieOptions('https://x.example', new Date(now + 3600_000), now).maxAge).toBe(3600);
    expect(shareCookieOptions('https://x.example', new Date(now + 1000), now).maxAge).toBe(60);
    expect(shareCookieOptions('https://x.example', null, now).maxAge).toBe(60 * 60 * 24 * 30);
  });
});

describe('PLUMBLINE_DEMO: the demo people are seeded unless switched off', () => {
  test.each([
    [undefined, true],
    ['1', true],
    ['0', false],
    ['false', false],
    [' OFF ', false],
    ['no', false],
  ])('%s → %s', (value, on) => expect(demoEnabled(value)).toBe(on));
});
