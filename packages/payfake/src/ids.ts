import { randomBytes } from 'node:crypto';

/** Ids with the hosted service's prefixes (cs_test_, pi_, ch_, re_, evt_...), random so two runs never clash. */
export function newId(prefix: string, length = 24): string {
  return `${prefix}_${randomBytes(length).toString('base64url').replace(/[-_]/g, 'x').slice(0, length)}`;
}

export const nowSeconds = (): number => Math.floor(Date.now() / 1000);
