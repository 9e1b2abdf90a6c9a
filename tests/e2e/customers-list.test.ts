import type { Locator } from '@playwright/test';
import { callApi } from './support/api-session';
import { mainNav, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { inviteMember, signUpFirm } from './support/firm-fixtures';
import { addCustomer, addSite } from './support/job-fixtures';

// Issue 14: 159 customers were one 19,600 px page. The list now comes a page at a time (25 a page) and is
// searched by the server, by name, street or postcode (a postcode matched with or without its space).

// Signing a firm up and adding 27 customers one by one runs past the default on a loaded 2-core machine.
test.describe.configure({ timeout: 180_000 });

test.use({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });

test('the office pages through more customers than one page and finds them by name and by postcode', async ({
  page,
  baseURL,
}) => {
  const firm = await signUpFirm(baseURL!);
  const office = await inviteMember(firm, 'admin', 'Tamsin Veryan');
  // 26 customers of one name and one with a site: 27, one more than a page and then two.
  for (let i = 0; i < 26; i += 1) await addCustomer(office.session, { name: `Ashgrove ${String(i).padStart(2, '0')}` });
  const oona = await addCustomer(office.session, { name: 'Oona Ridgeway' });
  await addSite(office.session, oona.id, { address: '12 Kiln Lane, Marshby', postcode: 'MB3 7XY' });
  const apiTotal = async (q: string) =>
    (await callApi<{ total: number }>(office.session, 'get', `/api/customers?q=${encodeURIComponent(q)}&pageSize=25`))
      .total;

  await signIn(page, office.email, office.password);
  await mainNav(page).getByRole('link', { name: 'Jobs' }).click();
  await page.getByRole('link', { name: 'Customers and sites' }).click();
  await expect(page).toHaveURL(/\/customers$/);

  const list = page.getByRole('list', { name: 'Customers' });
  const names = list.locator(':scope > li > p.font-semibold');
  const status = page.getByText(/^(Loading… )?Showing /);
  const pager = page.getByRole('navigation', { name: 'Pages of customers' });
  const previous = pager.getByRole('button', { name: 'Previous' });
  const next = pager.getByRole('button', { name: 'Next' });

  await test.step('the first page: 25 of 27, in name order, Previous disabled', async () => {
    await expect(status).toHaveText('Showing 1–25 of 27 customers.');
    await expect(names).toHaveCount(25);
    await expect(names.first()).toHaveText('Ashgrove 00');
    await expect(names.last()).toHaveText('Ashgrove 24');
    await expect(pager).toContainText('Page 1 of 2');
    await expect(previous).toBeDisabled();
    await expect(next).toBeEnabled();
    // DEVELOPERS.md, phone first: 48 px targets, on the pager as everywhere.
    for (const [what, button] of [
      ['Previous', previous],
      ['Next', next],
    ] as [string, Locator][]) {
      const box = await button.boundingBox();
      expect(box, `${what} has a box`).not.toBeNull();
      expect(box!.height, `${what} is a 48 px target`).toBeGreaterThanOrEqual(48);
      expect(box!.width, `${what} is a 48 px target`).toBeGreaterThanOrEqual(48);
    }
  });

  await test.step('Next asks the server for page 2: the last two, then back again', async () => {
    const asked = page.waitForResponse((r) => /\/api\/customers\?.*page=2/.test(r.url()) && r.status() === 200);
    await next.tap();
    await asked;
    await expect(status).toHaveText('Showing 26–27 of 27 customers.');
    await expect(names).toHaveText(['Ashgrove 25', 'Oona Ridgeway']);
    await expect(pager).toContainText('Page 2 of 2');
    await expect(next).toBeDisabled();
    await expect(page).toHaveURL(/[?&]page=2/);
    await previous.tap();
    await expect(status).toHaveText('Showing 1–25 of 27 customers.');
    await expect(names.first()).toHaveText('Ashgrove 00');
  });

  const search = page.getByRole('searchbox', { name: /Find a customer or address/ });

  await test.step('a search by name is answered by the server, with its own count and pages', async () => {
    await next.tap();
    await expect(page).toHaveURL(/[?&]page=2/);
    const asked = page.waitForResponse((r) => /\/api\/customers\?.*q=ashgrove/i.test(r.url()) && r.status() === 200);
    await search.fill('ashgrove');
    await asked;
    // A new search starts at its first page.
    await expect(status).toHaveText('Showing 1–25 of 26 customers matching "ashgrove".');
    expect(await apiTotal('ashgrove')).toBe(26);
    await expect(pager).toContainText('Page 1 of 2');
    await next.tap();
    await expect(status).toHaveText('Showing 26–26 of 26 customers matching "ashgrove".');
    await expect(names).toHaveText(['Ashgrove 25']);
  });

  await test.step('a postcode typed without its space finds the one site, and no pager', async () => {
    const asked = page.waitForResponse((r) => /\/api\/customers\?.*q=mb37x/i.test(r.url()) && r.status() === 200);
    await search.fill('mb37x');
    await asked;
    await expect(status).toHaveText('Showing 1–1 of 1 customer matching "mb37x".');
    expect(await apiTotal('mb37x')).toBe(1);
    await expect(names).toHaveText(['Oona Ridgeway']);
    await expect(list.getByRole('link', { name: /12 Kiln Lane, Marshby, MB3 7XY/ })).toBeVisible();
    await expect(pager).toHaveCount(0);
  });

  await test.step('a search nobody matches says so; clearing it brings back all 27', async () => {
    await search.fill('zz-nobody');
    await expect(page.getByText('No customer or site matches "zz-nobody".')).toBeVisible();
    await expect(list).toHaveCount(0);
    await search.fill('');
    await expect(status).toHaveText('Showing 1–25 of 27 customers.');
    await expect(page).toHaveURL(/\/customers$/);
  });
});
