/** How a firm's money documents are numbered on paper: a prefix and the sequence's number, 5 digits at least. */
export const documentPrefixes = { invoice: 'INV', credit_note: 'CN', quote: 'Q' } as const;
export type DocumentKind = keyof typeof documentPrefixes;

export function documentNumber(kind: DocumentKind, n: number): string {
  return `${documentPrefixes[kind]}-${String(n).padStart(5, '0')}`;
}
