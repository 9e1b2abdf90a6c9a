import type { MarketingSuppression } from '@heatfleet/domain';
import { callApi } from './support/api-session';
import { signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { signUpFirm } from './support/firm-fixtures';

// Issue 14: the yearly check e-mail offers a paid visit, so it is direct marketing, and a customer who refuses it
// is never sent it again (Privacy and Electronic Communications Regulations 2003, regulation 22(2)). Besides the
// link in each e-mail, a customer may ask the office by phone: the office adds the address on Settings.

test('the office stops offers to an address a customer gave by phone, and sees the list', async ({ page, baseURL }) => {
  const firm = await signUpFirm(baseURL!);
  await signIn(page, firm.owner.email, firm.owner.password);
  await page.goto('/settings');
  const card = page.getByRole('form', { name: 'Stop offers to an address' });
  await expect(page.getByText('Nobody has asked to stop the offers yet.')).toBeVisible();

  const address = card.getByRole('textbox', { name: "Customer's e-mail address" });
  await address.fill('not an address');
  await card.getByRole('button', { name: 'Stop offers' }).click();
  await expect(card.getByText('"not an address" is not an e-mail address.')).toBeVisible();

  await address.fill('Householder.Pendeen@Example.test');
  await card.getByRole('button', { name: 'Stop offers' }).click();
  await expect(page.getByText('householder.pendeen@example.test will not be sent offers again.')).toBeVisible();
  const list = page.getByRole('list', { name: 'Addresses not sent offers' });
  await expect(list.getByRole('listitem')).toHaveCount(1);
  await expect(list).toContainText('householder.pendeen@example.test');
  await expect(list).toContainText('Added by the office');

  const { suppressions } = await callApi<{ suppressions: MarketingSuppression[] }>(
    firm.owner.session,
    'get',
    '/api/marketing-suppressions',
  );
  expect(suppressions).toEqual([
    expect.objectContaining({ email: 'householder.pendeen@example.test', source: 'office' }),
  ]);
});
