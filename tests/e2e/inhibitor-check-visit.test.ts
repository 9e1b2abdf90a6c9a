import { addMonths, calendarDateIn, type OutboxMessage, type OutboxMessageSummary } from '@heatfleet/domain';
import { callApi, type ApiSession } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { mainNav, runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { addCustomer, addSite } from './support/job-fixtures';
import { createProduct, isoDaysFromNow, receiveStock, transferStock } from './support/stock-fixtures';

// Inhibitor check visits on a phone (DEVELOPERS.md, Product rules): a reading is judged against the product's own
// target range (an invented 100 to 300 ppm here); a visit that passes, on the first reading or on a re-test after
// a top-up, sets the next check 12 calendar months on, one that still fails 1 month on (common practice (no
// source)); the top-up's packs come off the van's stock. The customer gets a short note of the result.

test.describe.configure({ timeout: 180_000 });

test.use({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });

interface SiteAnswer {
  nextCheckOn: string | null;
}

/** "4 December 2027": a date as the customer's note prints it (GOV.UK style), computed here apart from the app. */
const longDate = (iso: string) =>
  new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(`${iso}T12:00:00Z`),
  );
const months = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/** "4 Dec 2027": a date as the app's screens show it (packages/domain uk-dates.ts). */
const shortDate = (iso: string) => {
  const [y, m, d] = iso.split('-').map(Number) as [number, number, number];
  return `${d} ${months[m - 1]} ${y}`;
};

async function packsOnVan(session: ApiSession, vanId: number, productId: number): Promise<number> {
  const { batches } = await callApi<{ batches: { quantity: number }[] }>(
    session,
    'get',
    `/api/stock/batches?locationId=${vanId}&productId=${productId}`,
  );
  return batches.reduce((sum, b) => sum + b.quantity, 0);
}

async function noteTo(session: ApiSession, to: string, subject: RegExp): Promise<OutboxMessage> {
  let found: OutboxMessageSummary | undefined;
  await expect
    .poll(
      async () => {
        const { messages } = await callApi<{ messages: OutboxMessageSummary[] }>(session, 'get', '/api/outbox');
        found = messages.find((m) => m.to.some((t) => t.toLowerCase() === to) && subject.test(m.subject));
        return found !== undefined;
      },
      { message: `a note to ${to}`, timeout: 30_000 },
    )
    .toBe(true);
  return (await callApi<{ message: OutboxMessage }>(session, 'get', `/api/outbox/${found!.id}`)).message;
}

test('an engineer tops up and re-tests a failed check in the same visit; a failed check left alone is due in a month', async ({
  page,
  baseURL,
}) => {
  const { owner, engineer, van, depot } = await firmWithCrew(baseURL!);
  const tag = runId().slice(-5).toUpperCase();
  const inhibitor = await createProduct(owner.session, {
    name: `Check inhibitor ${tag}`,
    kind: 'inhibitor',
    packSize: 500,
    packUnit: 'ml',
    targetMin: 100,
    targetMax: 300,
    targetUnit: 'ppm',
  });
  await receiveStock(owner.session, {
    locationId: depot.id,
    lines: [{ productId: inhibitor.id, lotNumber: `INH${tag}`, expiresOn: isoDaysFromNow(400), quantity: 3 }],
  });
  await transferStock(owner.session, {
    fromLocationId: depot.id,
    toLocationId: van.id,
    lines: [{ productId: inhibitor.id, quantity: 3 }],
  });
  const email = `householder-${tag.toLowerCase()}@customer.example`;
  const customer = await addCustomer(owner.session, { name: `Morwen Trevail ${tag}`, email });
  const topped = await addSite(owner.session, customer.id, {
    address: '3 Chapel Row, Polkerris Bay',
    postcode: 'PB1 2CR',
  });
  const leftAlone = await addSite(owner.session, customer.id, { address: 'Flat 2, Quay House, Polkerris Bay' });
  expect(await packsOnVan(owner.session, van.id, inhibitor.id)).toBe(3);

  const today = calendarDateIn(new Date(), 'Europe/London');
  const yearOn = addMonths(today, 12);
  const monthOn = addMonths(today, 1);
  const siteAnswer = async (id: number) =>
    (await callApi<{ nextCheckOn: string | null }>(owner.session, 'get', `/api/sites/${id}`)) as SiteAnswer;

  await signIn(page, engineer.email, engineer.password);
  await mainNav(page).getByRole('link', { name: 'Jobs' }).click();
  await page.getByRole('link', { name: 'Customers and sites' }).click();
  await page.getByRole('link', { name: /3 Chapel Row, Polkerris Bay/ }).click();
  await expect(page.getByRole('heading', { name: '3 Chapel Row, Polkerris Bay' })).toBeVisible();
  const form = page.getByRole('form', { name: 'Record an inhibitor check' });

  await test.step('60 ppm fails; topped up 2 packs from the van and re-tested at 180 ppm, the visit passes', async () => {
    const reading = form.getByLabel('Inhibitor reading (ppm)');
    await expect(reading).toHaveAttribute('inputmode', 'decimal');
    await reading.fill('60');
    await expect(form.getByText('Fail: below the target')).toBeVisible();
    await expect(form).toContainText(`60 ppm is below ${inhibitor.name}'s target of 100 to 300 ppm.`);
    const topUp = form.getByRole('group', { name: 'Top up and test again (optional)' });
    await expect(topUp.getByLabel('From van')).toHaveValue(String(van.id));
    const packs = topUp.getByLabel('Packs added');
    await expect(packs).toHaveAttribute('inputmode', 'numeric');
    await packs.fill('2');
    await topUp.getByLabel('Re-test reading').fill('180');
    await expect(topUp.getByText('Re-test: pass')).toBeVisible();
    await expect(topUp).toContainText('the next check falls a year on');
    for (const box of [
      reading,
      form.getByLabel('Inhibitor in the system'),
      packs,
      topUp.getByLabel('Re-test reading'),
      topUp.getByLabel('From van'),
    ]) {
      expect((await box.boundingBox())!.height).toBeGreaterThanOrEqual(48); // DEVELOPERS.md: 48 px targets
    }
    await form.getByRole('button', { name: 'Save the check' }).click();
    const saved = form.getByText('Check recorded: pass on the re-test');
    await expect(saved).toBeVisible();
    await expect(form).toContainText(`Next check due ${shortDate(yearOn)}.`);
    await expect(form).toContainText('2 packs taken off Van 1.');
    await expect(form).toContainText('The customer has been e-mailed the result.');
    const history = page.locator('section').filter({ has: page.getByRole('heading', { name: 'Inhibitor checks' }) });
    await expect(history).toContainText('Topped up 2 packs from Van 1; re-test 180 ppm (first reading: fail)');
    await expect(history).toContainText(`Next check set for ${shortDate(yearOn)}`);
  });

  await test.step('through the API: a year on, and the 2 packs came off the van', async () => {
    expect((await siteAnswer(topped.id)).nextCheckOn).toBe(yearOn);
    expect(await packsOnVan(owner.session, van.id, inhibitor.id)).toBe(1);
    const note = await noteTo(owner.session, email, /./);
    expect(note.text).toContain(
      'We topped up the inhibitor (2 packs) and tested again: 180 ppm, within the target range.',
    );
    expect(note.text).toContain(`The next check is due by ${longDate(yearOn)}.`);
    expect(note.text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });

  await test.step('at the other site 60 ppm with no top-up fails: the next check is a month on, not a year', async () => {
    await page.getByRole('link', { name: 'All customers' }).click();
    await page.getByRole('link', { name: /Flat 2, Quay House, Polkerris Bay/ }).click();
    await expect(page.getByRole('heading', { name: 'Flat 2, Quay House, Polkerris Bay' })).toBeVisible();
    await form.getByLabel('Inhibitor reading (ppm)').fill('60');
    await expect(form.getByText('Fail: below the target')).toBeVisible();
    await form.getByRole('button', { name: 'Save the check' }).click();
    await expect(form.getByText(/^Check recorded: fail$/)).toBeVisible();
    await expect(form).toContainText(`Next check due ${shortDate(monthOn)}.`);
    await expect(form).not.toContainText('taken off');
    expect((await siteAnswer(leftAlone.id)).nextCheckOn).toBe(monthOn);
    expect(monthOn).not.toBe(yearOn);
    // Nothing more came off the van.
    expect(await packsOnVan(owner.session, van.id, inhibitor.id)).toBe(1);
  });
});
