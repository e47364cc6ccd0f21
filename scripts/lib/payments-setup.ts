// Payments for a started server: the real service when STRIPE_SECRET_KEY is set (with STRIPE_WEBHOOK_SECRET, and
// STRIPE_API_BASE only to point elsewhere), otherwise the local fake (scripts/lib/fake-payments.ts) with fresh
// test-shaped keys, its webhooks sent to this server. Shared by `npm start` and `npm run start:scaled`.
import { startFakePayments, localPaymentKeys } from './fake-payments';

export interface PaymentSettings {
  STRIPE_SECRET_KEY: string;
  STRIPE_WEBHOOK_SECRET: string;
  STRIPE_API_BASE?: string;
}

export async function startPayments(siteUrl: string): Promise<{ settings: PaymentSettings | null; fakeUrl: string | null }> {
  const { STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET, STRIPE_API_BASE } = process.env;
  if (STRIPE_SECRET_KEY) {
    if (!STRIPE_WEBHOOK_SECRET) console.log('  ! STRIPE_SECRET_KEY is set without STRIPE_WEBHOOK_SECRET: payment events cannot be verified, so nothing unlocks.');
    return { settings: STRIPE_WEBHOOK_SECRET ? { STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET, ...(STRIPE_API_BASE ? { STRIPE_API_BASE } : {}) } : null, fakeUrl: null };
  }
  const keys = localPaymentKeys();
  const fake = await startFakePayments({
    ...keys,
    webhookUrl: new URL('/api/payments/webhook', siteUrl).toString(),
    port: Number(process.env.PLUMBLINE_PAYMENTS_PORT ?? 0),
    onEvent: (event, status) => console.log(`  ¤ test payment service: ${event.type} → ${status ?? 'unreachable'}`),
  });
  return { settings: fake.settings, fakeUrl: fake.url };
}

/** The start scripts' line saying which payment service a started server talks to. */
export const paymentsLine = ({ settings, fakeUrl }: { settings: PaymentSettings | null; fakeUrl: string | null }) =>
  fakeUrl ? `  payments: local test service at ${fakeUrl} (no money moves)` : settings ? '  payments: the payment service (STRIPE_SECRET_KEY)' : '  payments: not set up';
