export * from './pence.ts';
export * from './vat-lines.ts';
export * from './invoice-state.ts';
export * from './price-list.ts';
export * from './money-schemas.ts';
export * from './money-responses.ts';
export * from './cancellation.ts';
export * from './document-number.ts';
