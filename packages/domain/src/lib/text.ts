import { z } from 'zod';

/**
 * Characters that have no place in a name: C0/C1 controls (line breaks, tabs, escape), the Unicode
 * line and paragraph separators, and the bidirectional overrides that can make text read backwards
 * (Unicode Technical Report #36, "Unicode Security Considerations", section 2.4).
 */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const NOT_IN_A_NAME = /[\u0000-\u001F\u007F-\u009F\u2028\u2029\u202A-\u202E\u2066-\u2069]/u;
/** Controls other than line breaks and tabs: refused in multi-line text such as addresses and notes. */
// eslint-disable-next-line no-control-regex -- as above
const NOT_IN_TEXT = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\u202A-\u202E\u2066-\u2069]/u;
/** A web address in a name would become a link in an e-mail that quotes it. */
const LINK = /(?:[a-z][a-z0-9+.-]*:\/\/|www\.)/i;

export function hasControlCharacters(s: string): boolean {
  return NOT_IN_A_NAME.test(s);
}

/**
 * A name: one line, trimmed, bounded to its column. Names reach e-mails ("X invited you to join Y"),
 * so line breaks and web addresses are refused rather than carried into someone's inbox.
 */
export function singleLineName(label: string, opts: { min?: number; max: number }) {
  const min = opts.min ?? 1;
  return z
    .string({ error: `${label} is required.` })
    .trim()
    .min(min, { error: min <= 1 ? `${label} is required.` : `${label} must be at least ${min} characters.` })
    .max(opts.max, { error: `${label} must be at most ${opts.max} characters.` })
    .refine((s) => !NOT_IN_A_NAME.test(s), {
      error: `${label} must be one line of plain text (no line breaks or control characters).`,
    })
    .refine((s) => !LINK.test(s), { error: `${label} cannot contain a web address.` });
}

/** Free text that may run over several lines (notes, addresses), without hidden control characters. */
export function plainText(label: string, max: number) {
  return z
    .string({ error: `${label} must be text.` })
    .trim()
    .max(max, { error: `${label} must be at most ${max} characters.` })
    .refine((s) => !NOT_IN_TEXT.test(s), {
      error: `${label} contains control characters; type it again as plain text.`,
    });
}

/** Optional free text: empty becomes null. */
export function optionalPlainText(label: string, max: number) {
  return plainText(label, max)
    .transform((s) => (s === '' ? null : s))
    .nullable()
    .optional();
}
