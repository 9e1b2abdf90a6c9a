import { useSyncExternalStore } from 'react';

const never = () => () => undefined;

/**
 * false while React takes over markup that came with the HTML (the pre-rendered sign-in page) and at build-time
 * rendering; true otherwise, from the first render. A form keeps its submit button disabled until then, so a tap
 * before the scripts have run is not lost to the browser's own submit.
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    never,
    () => true,
    () => false,
  );
}
