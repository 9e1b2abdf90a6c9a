import { expect, test } from '@playwright/test';
import { expectNavLinks, mainNav, runId } from './support/e2e-helpers';

// Invented people and an invented domain; a fresh firm per run.
const ownerPassword = 'slate-kettle-harbour-42';
const engineerPassword = 'copper-lantern-meadow-17';

test('an owner invites an engineer from Team, who joins from the e-mail and sees only what an engineer may', async ({
  browser,
  page,
  baseURL,
}) => {
  const id = runId();
  const firmName = `Fernbrook Heating ${id}`;
  const ownerEmail = `owner-${id}@fernbrook.example`;
  const engineerEmail = `engineer-${id}@fernbrook.example`;

  await test.step('a new user creates a firm and becomes its Owner', async () => {
    await page.goto('/sign-up');
    await page.getByLabel('Firm name').fill(firmName);
    await page.getByLabel('Your name').fill('Wren Ashdown');
    await page.getByLabel('E-mail', { exact: true }).fill(ownerEmail);
    await page.getByLabel('Password', { exact: true }).fill(ownerPassword);
    await page.getByRole('button', { name: 'E-mail me the link' }).click();
    await expect(page.getByRole('status').filter({ hasText: 'Check your e-mail' })).toBeVisible();

    // The link arrives by e-mail; the test stack's mail catcher shows it in the Outbox.
    await page.getByRole('link', { name: /Open the Outbox/ }).click();
    const mail = page.getByRole('list', { name: 'Caught e-mails' }).getByRole('link').filter({ hasText: ownerEmail });
    await expect(mail.first()).toBeVisible({ timeout: 30_000 });
    await mail.first().click();
    const link = page.getByRole('link', { name: /\/sign-up\/confirm\/[A-Za-z0-9_-]+/ }).first();
    await expect(link).toBeVisible();
    await page.goto(new URL((await link.getAttribute('href')) ?? '', baseURL).pathname);
    await page.getByRole('button', { name: 'Create the firm' }).click();

    await expect(page.getByRole('heading', { level: 1, name: firmName })).toBeVisible();
    await expect(page.getByRole('heading', { name: 'Your role: Owner' })).toBeVisible();
    // A new firm has no van for its owner yet, so no "My van".
    await expectNavLinks(page, [
      'Home',
      'Vans',
      'Jobs',
      'Kits',
      'Stock',
      'Reminders',
      'Team',
      'Vibration',
      'Settings',
      'Money',
      'Billing',
      'Outbox',
    ]);
  });

  await test.step('the Owner invites an engineer from Team', async () => {
    await mainNav(page).getByRole('link', { name: 'Team' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'Team' })).toBeVisible();
    await page.getByLabel('E-mail of the person to invite').fill(engineerEmail);
    await page.getByLabel('Role', { exact: true }).selectOption('engineer');
    await page.getByRole('button', { name: 'Send invitation' }).click();

    await expect(page.getByRole('status').filter({ hasText: `Invitation sent to ${engineerEmail}` })).toBeVisible();
    await expect(page.getByRole('list', { name: 'Pending invitations' })).toContainText(engineerEmail);
  });

  let invitationPath = '';
  await test.step('the invitation e-mail is read in the Outbox', async () => {
    await mainNav(page).getByRole('link', { name: 'Outbox' }).click();
    const mail = page
      .getByRole('list', { name: 'Caught e-mails' })
      .getByRole('link')
      .filter({ hasText: engineerEmail });
    // Sent by a background job after the request commits, so it can take a moment to arrive.
    await expect(mail.first()).toBeVisible({ timeout: 30_000 });
    await mail.first().click();

    await expect(page.getByText(`${engineerEmail}`).first()).toBeVisible();
    const link = page.getByRole('link', { name: /\/invitations\/[A-Za-z0-9_-]+/ }).first();
    await expect(link).toBeVisible();
    const href = await link.getAttribute('href');
    expect(href).toBeTruthy();
    invitationPath = new URL(href ?? '', baseURL).pathname;
    expect(invitationPath).toMatch(/^\/invitations\/[A-Za-z0-9_-]{20,}$/);
  });

  const engineerContext = await browser.newContext({ baseURL });
  const engineer = await engineerContext.newPage();

  await test.step('the engineer accepts in another browser with a new account', async () => {
    await engineer.goto(invitationPath);
    await expect(engineer.getByText(firmName)).toBeVisible();
    await expect(engineer.getByText('Engineer', { exact: true })).toBeVisible();
    await engineer.getByLabel('Your name').fill('Tamsin Crowle');
    await engineer.getByLabel('Choose a password').fill(engineerPassword);
    await engineer.getByRole('button', { name: 'Create my account and join' }).click();

    await expect(engineer.getByRole('heading', { level: 1, name: firmName })).toBeVisible();
    await expect(engineer.getByRole('heading', { name: 'Your role: Engineer' })).toBeVisible();
  });

  await test.step('the engineer sees the team read-only, without invite or role controls', async () => {
    // Outbox shows because the test stack runs a mail catcher; nothing else beyond what an engineer may open.
    // No van assigned yet, so no "My van"; no Reminders or Settings for an engineer.
    await expectNavLinks(engineer, ['Home', 'Vans', 'Jobs', 'Kits', 'Stock', 'Team', 'Outbox']);
    await mainNav(engineer).getByRole('link', { name: 'Team' }).click();

    const members = engineer.getByRole('table', { name: 'Members of the firm' });
    await expect(members.getByRole('row').filter({ hasText: ownerEmail })).toBeVisible();
    await expect(members.getByRole('row').filter({ hasText: engineerEmail })).toBeVisible();

    await expect(engineer.getByRole('heading', { name: 'Invite someone' })).toHaveCount(0);
    await expect(engineer.getByRole('button', { name: 'Send invitation' })).toHaveCount(0);
    await expect(engineer.getByRole('heading', { name: 'Pending invitations' })).toHaveCount(0);
    await expect(engineer.getByRole('button', { name: /^Change role/ })).toHaveCount(0);
    await expect(engineer.getByRole('button', { name: /Deactivate|Reactivate|Withdraw/ })).toHaveCount(0);
  });

  await test.step('the Owner now sees the engineer as a member with a role to manage', async () => {
    await mainNav(page).getByRole('link', { name: 'Team' }).click();
    const row = page
      .getByRole('table', { name: 'Members of the firm' })
      .getByRole('row')
      .filter({ hasText: engineerEmail });
    await expect(row).toBeVisible();
    await expect(row.getByRole('button', { name: 'Change role for Tamsin Crowle' })).toBeVisible();
    await expect(row.getByRole('cell', { name: /Engineer/ })).toBeVisible();
    await expect(row.getByRole('button', { name: 'Deactivate Tamsin Crowle' })).toBeVisible();
    await expect(page.getByRole('list', { name: 'Pending invitations' })).toHaveCount(0);
  });

  await engineerContext.close();
});
