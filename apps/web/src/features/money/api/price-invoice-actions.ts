import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  invoiceSchema,
  moneySettingsSchema,
  priceItemSchema,
  type CreditNoteInput,
  type MoneyLineInput,
  type MoneySettingsInput,
  type PriceItemInput,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { moneyQueries } from './money-queries';

// The price list's and an invoice's writes (issue 15): each refreshes the money queries it changes.

export const invoiceQuery = (id: number) =>
  queryOptions({
    queryKey: [...moneyQueries.all(), 'invoice', id] as const,
    queryFn: () => apiClient.get(`/api/invoices/${id}`, invoiceSchema),
  });

/** Pence as the box shows it for editing: 1250 -> "12.50" (integer arithmetic, no float). */
export function penceToPoundsText(pence: number): string {
  return `${Math.floor(pence / 100)}.${String(pence % 100).padStart(2, '0')}`;
}

export function useSaveMoneySettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: MoneySettingsInput) => apiClient.put('/api/money/settings', input, moneySettingsSchema),
    onSuccess: () => qc.invalidateQueries({ queryKey: moneyQueries.all() }),
  });
}

export function useSavePriceItem() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number | null; input: PriceItemInput }) =>
      id === null
        ? apiClient.post('/api/money/price-items', input, priceItemSchema)
        : apiClient.put(`/api/price-items/${id}`, input, priceItemSchema),
    onSuccess: () => qc.invalidateQueries({ queryKey: moneyQueries.all() }),
  });
}

function useInvoiceWrite<V>(write: (v: V) => Promise<unknown>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: write, onSuccess: () => qc.invalidateQueries({ queryKey: moneyQueries.all() }) });
}

export const useSaveInvoiceLines = (id: number) =>
  useInvoiceWrite((lines: MoneyLineInput[]) => apiClient.put(`/api/invoices/${id}/lines`, { lines }, invoiceSchema));
export const useIssueInvoice = (id: number) =>
  useInvoiceWrite(() => apiClient.post(`/api/invoices/${id}/issue`, undefined, invoiceSchema));
export const useCreditInvoice = (id: number) =>
  useInvoiceWrite((input: CreditNoteInput) => apiClient.post(`/api/invoices/${id}/credit-notes`, input, invoiceSchema));
