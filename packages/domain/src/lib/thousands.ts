/**
 * A whole number with a comma between thousands, as en-GB writes it (1,234,567). Plain string work rather than
 * `toLocaleString`: the first use of the locale's number formatting loads its data, about 50 ms on the phone's
 * first page (README, "Round two"), and the schemas' messages are built when the app starts.
 */
export function withThousands(n: number): string {
  if (!Number.isSafeInteger(n)) throw new RangeError(`withThousands takes a whole number, not ${n}.`);
  const digits = String(Math.abs(n)).replace(/\B(?=(\d{3})+$)/g, ',');
  return n < 0 ? `-${digits}` : digits;
}
