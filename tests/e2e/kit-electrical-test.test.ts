import type { KitItemDetailResponse } from '@heatfleet/domain';
import { callApi } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { addKitItem, itemKindNamed } from './support/fleet-fixtures';
import { isoDaysFromNow } from './support/stock-fixtures';

// An electrical kind's in-service inspection and test on a phone, after the IET Code of Practice for In-service
// Inspection and Testing of Electrical Equipment (5th edition, 2020; limits from memory): Class I insulation
// resistance at least 1 megohm, Class II at least 2 and no earth continuity test; earth continuity at most
// 0.1 ohm plus the cord's own. A failed test takes the item out of service, so it cannot go out on a van.

test.describe.configure({ timeout: 180_000 });

test.use({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });

test('an engineer records a failed electrical test; the pump goes out of service and cannot be checked out', async ({
  page,
  baseURL,
}) => {
  const { engineer, owner, van } = await firmWithCrew(baseURL!);
  const pump = await addKitItem(owner.session, {
    assetTag: `PUMP${runId().toUpperCase()}`.slice(0, 32),
    kindId: (await itemKindNamed(owner.session, 'Flushing pump')).id,
  });
  const calibratedOn = isoDaysFromNow(-120);

  await signIn(page, engineer.email, engineer.password);
  // Where the pump's QR label lands.
  await page.goto(`/kit-items/${pump.id}`);
  await expect(page.getByRole('heading', { name: pump.assetTag })).toBeVisible();
  const form = page.getByRole('form', { name: 'Record an inspection' });
  const fields = form.getByRole('group', { name: 'Electrical inspection and test' });

  await test.step('the test fields appear for an electrical kind, Class II without the earth test', async () => {
    await form
      .getByRole('group', { name: 'What was done' })
      .getByRole('radio', { name: /Inspection and test/ })
      .check();
    await expect(fields).toBeVisible();
    await expect(fields.getByRole('group', { name: 'Class' }).getByRole('radio', { name: /Class I\b/ })).toBeChecked();
    await expect(fields.getByLabel('Earth continuity (ohms)')).toHaveAttribute('inputmode', 'decimal');
    await expect(fields.getByLabel('Insulation resistance (megohms)')).toHaveAttribute('inputmode', 'decimal');
    await fields
      .getByRole('group', { name: 'Class' })
      .getByRole('radio', { name: /Class II/ })
      .check();
    await expect(fields.getByLabel('Earth continuity (ohms)')).toHaveCount(0);
    await expect(fields.getByLabel('Cord length (metres, optional)')).toHaveCount(0);
    await fields
      .getByRole('group', { name: 'Class' })
      .getByRole('radio', { name: /Class I\b/ })
      .check();
    await expect(fields.getByLabel('Earth continuity (ohms)')).toBeVisible();
  });

  await test.step('the figures typed show the outcome: 0.5 megohm is under the Class I minimum', async () => {
    await fields.getByRole('group', { name: 'Visual check' }).getByRole('radio', { name: /^Pass/ }).check();
    await fields.getByLabel('Earth continuity (ohms)').fill('0.08');
    await fields.getByLabel('Cord length (metres, optional)').fill('5');
    await fields.getByLabel('Cord conductor size (optional)').selectOption({ label: '1.5 mm²' });
    await fields.getByLabel('Insulation resistance (megohms)').fill('0.5');
    await fields.getByLabel('Tester used').fill('Tester 2, serial 0042');
    await fields.getByLabel('Tester calibrated on').fill(calibratedOn);
    await expect(
      fields.getByRole('group', { name: 'Polarity' }).getByRole('radio', { name: /Not relevant/ }),
    ).toBeChecked();
    await expect(fields.getByText('Test failed: record it as failed')).toBeVisible();
    await expect(fields).toContainText('Insulation resistance 0.5 MΩ is under the Class I minimum of 1 MΩ.');
    await expect(fields).toContainText('A failed test takes the item out of service.');
  });

  await test.step('recording it as passed is refused, and nothing is recorded', async () => {
    await form
      .getByRole('group', { name: 'Result' })
      .getByRole('radio', { name: /^Passed/ })
      .check();
    await form.getByRole('button', { name: 'Record inspection' }).click();
    // The API refuses it and the form says, at the Result, what to do; the live outcome above names the failed checks.
    await expect(form.getByRole('group', { name: 'Result' })).toHaveAccessibleDescription(
      'The electrical test failed: record the inspection as failed.',
    );
    const detail = await callApi<KitItemDetailResponse>(owner.session, 'get', `/api/kit-items/${pump.id}`);
    expect(detail.inspections).toEqual([]);
    expect(detail.item.condition).toBe('in_service');
  });

  await test.step('recorded as failed: out of service on screen and in the API', async () => {
    await form
      .getByRole('group', { name: 'Result' })
      .getByRole('radio', { name: /^Failed/ })
      .check();
    await form.getByRole('button', { name: 'Record inspection' }).click();
    await expect(
      page.getByText('Inspection recorded: failed. The item is out of service until it is repaired and tested again.'),
    ).toBeVisible();
    const condition = page.locator('dt', { hasText: /^Condition$/ }).locator('xpath=following-sibling::dd');
    await expect(condition).toHaveText('Out of service');
    const list = page.getByRole('list', { name: 'Inspections' });
    await expect(list).toContainText('Electrical test (Class I):');
    await expect(list).toContainText('Insulation resistance 0.5 MΩ is under the Class I minimum of 1 MΩ.');
    await expect(list).toContainText('tester Tester 2, serial 0042');

    const detail = await callApi<KitItemDetailResponse>(owner.session, 'get', `/api/kit-items/${pump.id}`);
    expect(detail.item.condition).toBe('out_of_service');
    expect(detail.inspections).toHaveLength(1);
    // 0.1 ohm + 5 m of 1.5 mm² cord at 13.3 milliohms a metre = 0.167 ohm (IET Code of Practice, from memory).
    expect(detail.inspections[0]).toMatchObject({
      result: 'failed',
      electrical: {
        equipmentClass: 'I',
        visual: 'pass',
        earthContinuityOhms: 0.08,
        earthLimitOhms: 0.167,
        insulationResistanceMohms: 0.5,
        insulationMinMohms: 1,
        polarity: 'not_applicable',
        testerUsed: 'Tester 2, serial 0042',
        testerCalibratedOn: calibratedOn,
        result: 'fail',
        failures: ['Insulation resistance 0.5 MΩ is under the Class I minimum of 1 MΩ.'],
      },
    });
  });

  await test.step('the engineer cannot check it out to the van, on screen or through the API', async () => {
    const custody = page.getByRole('region', { name: 'Custody' });
    await custody.getByRole('button', { name: 'Check out' }).click();
    await custody.getByRole('form', { name: 'Check out' }).getByRole('button', { name: 'Check out' }).click();
    await expect(custody.getByText(`${pump.assetTag} is out of service and cannot go out.`)).toBeVisible();
    const answer = await engineer.session.api.post(`/api/kit-items/${pump.id}/check-out`, {
      headers: { 'X-CSRF-Token': engineer.session.csrf, 'Idempotency-Key': `e2e-${runId()}` },
      data: { toLocationId: van.id },
    });
    expect(answer.status()).toBe(409);
    expect(((await answer.json()) as { error: string }).error).toBe('OutOfService');
    const detail = await callApi<KitItemDetailResponse>(owner.session, 'get', `/api/kit-items/${pump.id}`);
    expect(detail.item.location).toMatchObject({ kind: 'depot' });
  });
});
