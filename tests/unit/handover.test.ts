// The handover gate's pure rules: money in minor units, what each invoice holds back, how payment events move an
// invoice, and the webhook signature scheme checked against the provider's own SDK.
import { createHmac } from 'node:crypto';
import Stripe from 'stripe';
import { describe, expect, test } from 'vitest';
import { applyPaymentChange, CURRENCIES, formatAmount, invoiceInputSchema, isLocked, minorDigits, releasesShelfFile, releasesVersionPath, waitsForPayment, type InvoiceState } from '@/lib/handover/invoice';

describe('currencies (ISO 4217)', () => {
  // ISO 4217 list one (SIX Financial Information, the maintenance agency), "Minor unit" column.
  test.each([
    ['EUR', 2],
    ['USD', 2],
    ['GBP', 2],
    ['JPY', 0],
    ['KRW', 0],
    ['BHD', 3],
    ['KWD', 3],
    ['TND', 3],
  ])('%s has %i minor digits', (code, digits) => {
    expect(CURRENCIES).toContain(code);
    expect(minorDigits(code)).toBe(digits);
  });

  test('funds, metals and testing codes of the X block are not offered; X-coded national currencies are', () => {
    // ISO 4217: XAU gold, XTS reserved for testing, XXX no currency; XOF the West African CFA franc.
    for (const code of ['XAU', 'XTS', 'XXX']) expect(CURRENCIES).not.toContain(code);
    expect(CURRENCIES).toContain('XOF');
  });

  test.each([
    [125000, 'EUR', '1,250.00'],
    [5000, 'JPY', '5,000'],
    [1500, 'BHD', '1.500'],
  ])('%i minor units of %s read %s (en-GB), the point placed by the minor unit', (amount, currency, number) => {
    // The minor-unit column above decides where the point goes; the symbol is ICU's (CLDR) and not checked here.
    expect(formatAmount(amount, currency)).toContain(number);
    expect(formatAmount(amount, currency).replace(/[\d.,\s\u00a0]/g, '')).not.toBe('');
  });

  test('the form schema takes whole minor units, a listed currency and a real day', () => {
    const ok = { amount: 125000, currency: 'eur', dueOn: '2028-02-29', releases: 'print', clientEmail: 'A@Client.example' };
    expect(invoiceInputSchema.parse(ok)).toMatchObject({ currency: 'EUR', clientEmail: 'a@client.example' });
    for (const bad of [{ amount: 0.5 }, { amount: 0 }, { currency: 'ABC' }, { dueOn: '2027-02-29' }, { releases: 'all' }, { extra: 1 }]) {
      expect(invoiceInputSchema.safeParse({ ...ok, ...bad }).success).toBe(false);
    }
  });
});

describe('what an invoice holds back', () => {
  test('readers who wait: everyone but the studio side (owner, editor)', () => {
    expect([null, 'owner', 'editor', 'reviewer', 'partner', 'viewer'].map((r) => waitsForPayment(r as never))).toEqual([true, false, false, true, true, true]);
  });

  test.each<[InvoiceState, boolean]>([
    ['draft', true],
    ['sent', true],
    ['failed', true],
    ['refunded', true],
    ['paid', false],
  ])('an invoice %s locks: %s', (state, locked) => {
    expect(isLocked({ invoiceId: 'x', releases: 'shelf', state, stateReason: null })).toBe(locked);
  });

  test.each([
    // [releases, request, held]
    ['final-files', { kind: 'logo', format: 'original' }, true],
    ['final-files', { kind: 'logo', format: 'png', width: 2048 }, true],
    ['final-files', { kind: 'logo', format: 'png', width: 480 }, false],
    ['final-files', { kind: 'photo', format: 'original' }, false],
    ['final-files', { kind: 'bundle' }, true],
    ['print', { kind: 'logo', format: 'original' }, false],
    ['print', { kind: 'logo', preset: 'print' }, true],
    ['print', { kind: 'logo', format: 'eps', colorSpace: 'cmyk' }, true],
    ['print', { kind: 'bundle' }, true],
    ['shelf', { kind: 'photo', format: 'original' }, true],
    ['shelf', { kind: 'pattern', format: 'png', width: 256 }, false],
  ] as const)('%s holds %j: %s', (releases, request, held) => {
    expect(releasesShelfFile(releases, request)).toBe(held);
  });

  test.each([
    ['final-files', 'tokens?format=css', true],
    ['final-files', 'mockups/letterhead?format=pdf', false],
    ['print', 'mockups/letterhead?format=pdf', true],
    ['print', 'mockups/letterhead?format=png', false],
    ['shelf', 'mockups/letterhead?format=png', true],
    ['shelf', 'page/latest-member-downloads.html', false],
    ['shelf', 'files/abc?variant=white', false],
    ['shelf', 'guideline.pdf?size=a4', false],
  ] as const)('%s holds the version file %s: %s', (releases, path, held) => {
    expect(releasesVersionPath(releases, path)).toBe(held);
  });
});

describe('payment events in any order', () => {
  // The provider does not promise delivery in the order events happen (its webhook guide, "Event ordering", from
  // memory); each event carries its own `created` time, which decides.
  const t = (s: number) => new Date(Date.UTC(2027, 0, 1, 12, 0, s));
  test.each<[InvoiceState, Date | null, 'paid' | 'failed' | 'refunded', Date, InvoiceState | null]>([
    ['sent', null, 'paid', t(10), 'paid'],
    ['sent', null, 'failed', t(10), 'failed'],
    ['failed', t(10), 'paid', t(20), 'paid'],
    ['paid', t(20), 'failed', t(10), null],
    ['paid', t(20), 'refunded', t(30), 'refunded'],
    ['refunded', t(30), 'paid', t(20), null],
    ['refunded', t(30), 'paid', t(40), null],
    ['paid', t(20), 'paid', t(25), null],
    ['sent', null, 'refunded', t(10), null],
    ['draft', null, 'paid', t(10), null],
  ])('%s (last %s) + %s at %s → %s', (state, last, kind, at, next) => {
    expect(applyPaymentChange(state, last, { kind, at })).toBe(next);
  });
});

describe('webhook signatures (reference: the provider’s Node SDK)', () => {
  const secret = 'whsec_unit_test_secret';
  const payload = JSON.stringify({ id: 'evt_unit_1', object: 'event', type: 'charge.refunded', created: 1_800_000_000, data: { object: { id: 'ch_1', object: 'charge' } } });
  const sdk = new Stripe('sk_test_unit');

  test('the documented scheme (HMAC-SHA256 of "t.payload", hex, as v1) is what the SDK writes and accepts', () => {
    const timestamp = Math.floor(Date.now() / 1000);
    const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`).digest('hex');
    expect(sdk.webhooks.generateTestHeaderString({ payload, secret, timestamp })).toBe(`t=${timestamp},v1=${v1}`);
    expect(sdk.webhooks.constructEvent(payload, `t=${timestamp},v1=${v1}`, secret).id).toBe('evt_unit_1');
  });

  test('an altered payload, another secret or an old timestamp is refused', () => {
    const timestamp = Math.floor(Date.now() / 1000);
    const header = sdk.webhooks.generateTestHeaderString({ payload, secret, timestamp });
    expect(() => sdk.webhooks.constructEvent(payload.replace('charge.refunded', 'checkout.session.completed'), header, secret)).toThrow();
    expect(() => sdk.webhooks.constructEvent(payload, header, 'whsec_other')).toThrow();
    const old = sdk.webhooks.generateTestHeaderString({ payload, secret, timestamp: timestamp - 301 });
    expect(() => sdk.webhooks.constructEvent(payload, old, secret)).toThrow();
  });
});
