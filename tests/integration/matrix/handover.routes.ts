// The handover invoice (owner only), its pay link and the payment provider's webhook (no account: the link or the
// signature is the key).
import { all, only, withoutClientWork, type Route } from './route';

const b = (f: { brandId: string }) => `/api/brands/${f.brandId}/handover`;
const invoice = () => ({ amount: 125000, currency: 'EUR', dueOn: '2027-01-31', releases: 'final-files', clientEmail: 'client@matrix.example' });
// A 43-character token no link was ever made with.
const unknownToken = 'A'.repeat(43);

export default withoutClientWork([
  { method: 'GET', file: 'brands/[id]/handover/index.ts', path: b, expect: only(200, ['owner']) },
  { method: 'PUT', file: 'brands/[id]/handover/index.ts', path: b, body: invoice, expect: only(200, ['owner']) },
  // The fixture brand has no invoice: the owner learns so, nobody else is let that far.
  { method: 'DELETE', file: 'brands/[id]/handover/index.ts', path: b, expect: only(404, ['owner']) },
  { method: 'POST', file: 'brands/[id]/handover/send.ts', path: (f) => `${b(f)}/send`, body: () => ({}), expect: only(404, ['owner']) },
  { method: 'POST', file: 'brands/[id]/handover/refund.ts', path: (f) => `${b(f)}/refund`, body: () => ({}), expect: only(404, ['owner']) },
  { method: 'POST', file: 'pay/[token]/checkout.ts', path: () => `/api/pay/${unknownToken}/checkout`, body: () => ({}), expect: all(404, { anonymous: 404 }), mutates: false },
  // Unsigned: refused before anything is read, for everyone.
  { method: 'POST', file: 'payments/webhook.ts', path: () => '/api/payments/webhook', body: () => ({ id: 'evt_matrix', type: 'charge.refunded' }), expect: all(400, { anonymous: 400 }), mutates: false },
] satisfies Route[]);
