import type { Depot, KitDetailResponse } from '@heatfleet/domain';
import { callApi } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { horizontalOverflow, runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { addKitItem, checkOutKit, createKit, itemKindNamed } from './support/fleet-fixtures';

// A kit's check-in on a phone: each item its own condition (in service unless changed), the depot shown and
// changeable, and the magnet set's "cleaned" tick that puts it back in date (DEVELOPERS.md, Product rules:
// inspection due; the default magnet set is inspected after every use, common practice (no source)).

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true, isMobile: true });

test('an engineer checks a kit in with a condition per item, to the depot chosen, the magnets ticked as cleaned', async ({
  page,
  baseURL,
}, testInfo) => {
  const { engineer, stores, van } = await firmWithCrew(baseURL!, { stores: true });
  const session = stores!.session;
  const run = runId().toUpperCase();
  const kit = await createKit(session, `Magnet rig ${run}`);
  const magnet = await addKitItem(session, {
    assetTag: `MG${run}`.slice(0, 32),
    kindId: (await itemKindNamed(session, 'Magnet set')).id,
    kitId: kit.id,
  });
  const hose = await addKitItem(session, {
    assetTag: `HS${run}`.slice(0, 32),
    kindId: (await itemKindNamed(session, 'Hose set')).id,
    kitId: kit.id,
  });
  const { depot: north } = await callApi<{ depot: Depot }>(session, 'post', '/api/depots', {
    data: { name: 'North yard' },
  });
  await checkOutKit(session, kit.id, van.id);

  await signIn(page, engineer.email, engineer.password);
  await page.goto(`/kits/${kit.id}`);
  const custody = page.getByRole('region', { name: 'Custody' });
  await custody.getByRole('button', { name: 'Check in' }).click();
  const checkIn = page.getByRole('form', { name: 'Check in' });

  // Every item starts in service; only the magnet set (a use rule) offers the cleaned tick.
  const magnetCondition = checkIn.getByRole('combobox', { name: `Condition of ${magnet.assetTag}` });
  const hoseCondition = checkIn.getByRole('combobox', { name: `Condition of ${hose.assetTag}` });
  await expect(magnetCondition).toHaveValue('in_service');
  await expect(hoseCondition).toHaveValue('in_service');
  await expect(checkIn.getByRole('checkbox', { name: /Cleaned after the job/ })).toHaveCount(2);
  // The hose set has a use rule too (every 25 uses), so each row offers its own tick; tick only the magnets.
  const magnetRow = checkIn.getByRole('listitem').filter({ hasText: magnet.assetTag });
  await magnetRow.getByRole('checkbox', { name: /Cleaned after the job/ }).check();
  await hoseCondition.selectOption('needs_attention');

  // The depot is shown and can be changed.
  const depot = checkIn.getByRole('combobox', { name: 'Back to depot' });
  await expect(depot).toBeVisible();
  await depot.selectOption({ label: 'North yard' });

  const tick = magnetRow.locator('label').filter({ hasText: 'Cleaned after the job' });
  const targets = { magnetCondition, hoseCondition, depot, tick };
  for (const [name, target] of Object.entries(targets)) {
    await target.scrollIntoViewIfNeeded();
    const box = await target.boundingBox();
    expect(box, `${name} has a box`).not.toBeNull();
    expect(box!.height, `${name} is a 48 px target`).toBeGreaterThanOrEqual(48);
  }
  await page.screenshot({ path: testInfo.outputPath('kit-check-in-360.png'), fullPage: true });
  const overflow = await horizontalOverflow(page);
  expect(overflow.scrollWidth, `the check-in overflows: ${overflow.widest ?? ''}`).toBeLessThanOrEqual(360);

  await checkIn.getByRole('button', { name: 'Check in' }).click();
  await expect(custody.getByText('Checked in to North yard: 1 item not in service, 1 cleaned.')).toBeVisible();
  await expect(custody.locator('p').filter({ hasText: /^Now:/ })).toContainText('North yard');

  // What the server recorded: each item's own condition, the depot chosen, the magnets back in date.
  const detail = await callApi<KitDetailResponse>(session, 'get', `/api/kits/${kit.id}`);
  const byTag = Object.fromEntries(detail.items.map((i) => [i.assetTag, i]));
  expect(byTag[magnet.assetTag]).toMatchObject({
    condition: 'in_service',
    location: { id: north.id },
    inspection: { state: 'ok', usesSinceInspection: 0 },
  });
  expect(byTag[hose.assetTag]).toMatchObject({ condition: 'needs_attention', location: { id: north.id } });
  expect(detail.inspections).toEqual([
    expect.objectContaining({ itemId: magnet.id, result: 'passed', cleanedAtCheckIn: true }),
  ]);
});
