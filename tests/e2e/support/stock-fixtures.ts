import type { ParLevelInput, Product, ProductInput, ReceiptInput, StockMoved, TransferInput } from '@heatfleet/domain';
import { callApi, type ApiSession } from './api-session';

// Products and stock for a fixture firm (apps/api/src/modules/stock); moves carry an Idempotency-Key as the app's do.

export async function createProduct(session: ApiSession, input: ProductInput): Promise<Product> {
  return (await callApi<{ product: Product }>(session, 'post', '/api/products', { data: input })).product;
}

export async function setParLevel(session: ApiSession, input: ParLevelInput): Promise<void> {
  await callApi(session, 'put', '/api/par-levels', { data: input });
}

/** A delivery received at a depot, each line with its lot and use-by date. */
export async function receiveStock(session: ApiSession, input: ReceiptInput): Promise<StockMoved> {
  return callApi<StockMoved>(session, 'post', '/api/stock/receipts', { data: input, idempotent: true });
}

export async function transferStock(session: ApiSession, input: TransferInput): Promise<StockMoved> {
  return callApi<StockMoved>(session, 'post', '/api/stock/transfers', { data: input, idempotent: true });
}

/** A calendar date `days` from today (UTC), for use-by dates well clear of any clock change. */
export function isoDaysFromNow(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}
