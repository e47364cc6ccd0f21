// The handover screen's read and changes; each change refreshes the invoice.
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { useChange, type Reactions } from '@/lib/client/mutation';
import type { InvoiceInput } from '@/lib/handover/invoice';
import type { HandoverView, InvoiceView } from '@/lib/handover/views';

const path = (brandId: string) => `/api/brands/${brandId}/handover`;
const key = (brandId: string) => ['handover', brandId];

export const useHandover = (brandId: string, initial: HandoverView) =>
  useQuery({ queryKey: key(brandId), queryFn: () => api<HandoverView>(path(brandId)), initialData: initial, refetchInterval: (q) => (q.state.data?.invoice?.state === 'sent' ? 5000 : false) });

function useRefresh(brandId: string) {
  const client = useQueryClient();
  return () => client.invalidateQueries({ queryKey: key(brandId) });
}

export const useSaveInvoice = (brandId: string, on: Reactions<{ invoice: InvoiceView }, InvoiceInput>) =>
  useChange((body: InvoiceInput) => api<{ invoice: InvoiceView }>(path(brandId), { method: 'PUT', body }), useRefresh(brandId), on);

export const useSendInvoice = (brandId: string, on: Reactions<{ invoice: InvoiceView; mail: { sent: boolean; problem?: string } }, void>) =>
  useChange(() => api<{ invoice: InvoiceView; mail: { sent: boolean; problem?: string } }>(`${path(brandId)}/send`, { method: 'POST', body: {} }), useRefresh(brandId), on);

export const useRefundInvoice = (brandId: string, on: Reactions<unknown, void>) =>
  useChange(() => api(`${path(brandId)}/refund`, { method: 'POST', body: {} }), useRefresh(brandId), on);

export const useRemoveInvoice = (brandId: string, on: Reactions<unknown, void>) =>
  useChange(() => api(path(brandId), { method: 'DELETE' }), useRefresh(brandId), on);
