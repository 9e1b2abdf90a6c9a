import { test as base } from '@playwright/test';
import { disposeApiSessions } from './api-session';

export { expect } from '@playwright/test';

/** Playwright's test, closing the API clients a test's fixtures opened once it ends, passed or failed. */
export const test = base.extend<{ closeApiSessions: void }>({
  closeApiSessions: [
    // Playwright reads a fixture's dependencies from this first parameter, so it must be a pattern even when empty.
    // eslint-disable-next-line no-empty-pattern
    async ({}, use) => {
      await use();
      await disposeApiSessions();
    },
    { auto: true },
  ],
});
