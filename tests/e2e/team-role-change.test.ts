import type { Member } from '@heatfleet/domain';
import { callApi } from './support/api-session';
import { signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { inviteMember, signUpFirm } from './support/firm-fixtures';

// Issue 14: a live role drop-down on every member row let one slip demote someone. A role now changes only
// through a dialog that names the change and asks for it to be confirmed.

test('a role changes only after the confirm; cancelling or Escape changes nothing', async ({ page, baseURL }) => {
  const firm = await signUpFirm(baseURL!);
  const stores = await inviteMember(firm, 'stores', 'Morwenna Pascoe');
  const roleOf = async () =>
    (await callApi<{ members: Member[] }>(firm.owner.session, 'get', '/api/members')).members.find(
      (m) => m.id === stores.memberId,
    )?.role;

  await signIn(page, firm.owner.email, firm.owner.password);
  await page.goto('/team');
  const row = page
    .getByRole('table', { name: 'Members of the firm' })
    .getByRole('row')
    .filter({ hasText: stores.email });
  // No select on the row: nothing to change by a stray tap or a scroll wheel.
  await expect(row.getByRole('combobox')).toHaveCount(0);
  const open = row.getByRole('button', { name: 'Change role for Morwenna Pascoe' });
  const box = await open.boundingBox();
  expect(box?.height ?? 0).toBeGreaterThanOrEqual(48); // DEVELOPERS.md, phone first: 48 px targets

  await test.step('choosing a role and cancelling changes nothing', async () => {
    await open.click();
    const dialog = page.getByRole('dialog', { name: 'Change Morwenna Pascoe’s role' });
    await expect(dialog).toBeVisible();
    await expect(dialog.getByRole('button', { name: 'Choose a new role' })).toBeDisabled();
    await dialog.getByRole('radio', { name: /^Engineer/ }).check();
    await expect(dialog.getByText('Morwenna Pascoe changes from Stores to Engineer')).toBeVisible();
    await dialog.getByRole('button', { name: 'Keep as Stores' }).click();
    await expect(dialog).toHaveCount(0);
    expect(await roleOf()).toBe('stores');
  });

  await test.step('Escape closes the dialog and changes nothing', async () => {
    await open.click();
    const dialog = page.getByRole('dialog', { name: 'Change Morwenna Pascoe’s role' });
    await dialog.getByRole('radio', { name: /^Admin/ }).check();
    await page.keyboard.press('Escape');
    await expect(dialog).toHaveCount(0);
    expect(await roleOf()).toBe('stores');
  });

  await test.step('the confirm changes the role, and the row shows it', async () => {
    await open.click();
    const dialog = page.getByRole('dialog', { name: 'Change Morwenna Pascoe’s role' });
    await dialog.getByRole('radio', { name: /^Engineer/ }).check();
    await dialog.getByRole('button', { name: 'Make Engineer' }).click();
    await expect(dialog).toHaveCount(0);
    await expect.poll(roleOf).toBe('engineer');
    await expect(row.getByRole('cell', { name: /Engineer/ })).toBeVisible();
  });

  const activeOf = async () =>
    (await callApi<{ members: Member[] }>(firm.owner.session, 'get', '/api/members')).members.find(
      (m) => m.id === stores.memberId,
    )?.active;

  await test.step('Deactivate asks first: keeping them active changes nothing, the confirm deactivates', async () => {
    const deactivate = row.getByRole('button', { name: 'Deactivate Morwenna Pascoe' });
    expect((await deactivate.boundingBox())?.height ?? 0).toBeGreaterThanOrEqual(48); // DEVELOPERS.md: 48 px
    await deactivate.click();
    const dialog = page.getByRole('dialog', { name: 'Deactivate Morwenna Pascoe?' });
    await expect(dialog).toContainText('signed out of this firm at once');
    await dialog.getByRole('button', { name: 'Keep Morwenna Pascoe active' }).click();
    await expect(dialog).toHaveCount(0);
    expect(await activeOf()).toBe(true);

    await deactivate.click();
    await page.keyboard.press('Escape');
    await expect(dialog).toHaveCount(0);
    expect(await activeOf()).toBe(true);

    await deactivate.click();
    await dialog.getByRole('button', { name: 'Deactivate Morwenna Pascoe' }).click();
    await expect(dialog).toHaveCount(0);
    await expect.poll(activeOf).toBe(false);
    // Reactivating is harmless, so it happens at once.
    await row.getByRole('button', { name: 'Reactivate Morwenna Pascoe' }).click();
    await expect.poll(activeOf).toBe(true);
  });
});
