// An invoice's state follows from what has happened to it, never set by hand: issued or not, and the
// sums paid (net of refunds) and credited against it.

export const invoiceStates = ['draft', 'issued', 'part_paid', 'paid', 'credited'] as const;
export type InvoiceState = (typeof invoiceStates)[number];
export const invoiceStateLabels: Record<InvoiceState, string> = {
  draft: 'Draft',
  issued: 'Issued',
  part_paid: 'Part paid',
  paid: 'Paid',
  credited: 'Credited',
};

export interface InvoiceMoney {
  issued: boolean;
  totalPence: number;
  /** Payments received less refunds. */
  paidPence: number;
  /** Credit notes raised against it (their totals, VAT included). */
  creditedPence: number;
}

/** What is still owed: never below zero (an overpayment is the firm's to refund, not a negative debt). */
export function amountDue(m: InvoiceMoney): number {
  if (!m.issued) return 0;
  return Math.max(0, m.totalPence - m.creditedPence - m.paidPence);
}

/**
 * draft until issued; credited once credit notes cover the whole total and nothing stays paid;
 * paid once payments cover what the credit notes leave; part_paid with any payment short of that;
 * otherwise issued. A refund lowers paidPence, so a refunded invoice goes back to part_paid or issued.
 */
export function invoiceStateAfterPayments(m: InvoiceMoney): InvoiceState {
  if (!m.issued) return 'draft';
  const owedAfterCredit = m.totalPence - m.creditedPence;
  if (owedAfterCredit <= 0 && m.paidPence <= 0) return 'credited';
  if (m.paidPence >= owedAfterCredit) return 'paid';
  if (m.paidPence > 0) return 'part_paid';
  return 'issued';
}

/** Days since the invoice date, by the aged-debt bands of the owner's overview: 0-30, 31-60, over 60. */
export const agedBands = ['days_0_30', 'days_31_60', 'days_over_60'] as const;
export type AgedBand = (typeof agedBands)[number];
export function agedBand(daysSinceInvoice: number): AgedBand {
  if (daysSinceInvoice <= 30) return 'days_0_30';
  if (daysSinceInvoice <= 60) return 'days_31_60';
  return 'days_over_60';
}
