import { z } from 'zod';
import { customerSchema, customerSiteBriefSchema } from './site-schemas.ts';

/** The customers list (issue 14): searched and paged by the server, so a firm of thousands is one screen at a time. */
export const CUSTOMER_PAGE_SIZE = 25;
/** Without `pageSize`, a search answers the type-ahead's best 10 and a plain list one page. */
export const CUSTOMER_TYPE_AHEAD_SIZE = 10;

export const customerPageQuerySchema = z.strictObject({
  q: z
    .string({ error: 'Search with words, a postcode or an address.' })
    .trim()
    .min(1, { error: 'Type a letter or more to search.' })
    .max(80, { error: 'Search with at most 80 characters.' })
    .optional(),
  page: z.coerce
    .number({ error: 'The page must be a whole number.' })
    .int({ error: 'The page must be a whole number.' })
    .min(1, { error: 'Pages start at 1.' })
    .max(100_000, { error: 'The page must be at most 100,000.' })
    .default(1),
  pageSize: z.coerce
    .number({ error: 'The page size must be a whole number.' })
    .int({ error: 'The page size must be a whole number.' })
    .min(1, { error: 'The page size must be at least 1.' })
    .max(100, { error: 'The page size must be at most 100.' })
    .optional(),
});
export type CustomerPageQuery = z.infer<typeof customerPageQuerySchema>;

/** A site in the customers list: enough to book a job on it and to see its next annual check. */
export const customerPageSiteSchema = customerSiteBriefSchema.extend({ nextCheckOn: z.string().nullable() });

/**
 * One page of customers with their sites. A search puts names starting with the text first; `total` counts
 * every match, so the pager knows how many pages there are.
 */
export const customerPageResponseSchema = z.object({
  customers: z.array(customerSchema.extend({ sites: z.array(customerPageSiteSchema) })),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});
export type CustomerPageResponse = z.infer<typeof customerPageResponseSchema>;
export type CustomerPageRow = CustomerPageResponse['customers'][number];
