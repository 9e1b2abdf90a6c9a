import type { CreateJobInput, HavRegisterResponse } from '@heatfleet/domain';
import { callApi, type ApiSession } from './support/api-session';
import { firmWithCrew } from './support/crew-fixtures';
import { mainNav, runId, signIn } from './support/e2e-helpers';
import { expect, test } from './support/fixture-test';
import { inviteMember } from './support/firm-fixtures';
import { addKitItem, createVan, itemKindNamed, setVibration } from './support/fleet-fixtures';
import { addCustomer, addSite, bookJob } from './support/job-fixtures';
import { isoDaysFromNow } from './support/stock-fixtures';

// HSE's points system (INDG175 and L140, from memory): points = 2 x a² x hours, so a 10 m/s² tool for 30
// minutes in a day is 100 points, the exposure action value (2.5 m/s² A(8)), and 400 points the exposure limit
// value (5 m/s² A(8)), Control of Vibration at Work Regulations 2005. Anyone likely to be exposed at or over the
// action value needs health surveillance (regulation 7). The minutes are recorded as the job sheet records them.

test.describe.configure({ timeout: 180_000 });

const survey: CreateJobInput['survey'] = {
  systemType: 'sealed',
  boilerKind: 'combi',
  fuel: 'gas',
  radiators: [
    { room: 'Lounge', panel: 'double' },
    { room: 'Landing', panel: 'single' },
  ],
  pipeRuns: [],
};

/** A 10 m/s² agitator head on the van, and a job today for the engineer, with its agitation minutes recorded. */
async function agitateToday(
  owner: ApiSession,
  engineer: { session: ApiSession; memberId: number },
  vanId: number,
  minutes: number[],
) {
  const tag = runId().toUpperCase();
  const tool = await addKitItem(owner, {
    assetTag: `AGI${tag}`.slice(0, 32),
    kindId: (await itemKindNamed(owner, 'Agitator head')).id,
  });
  await setVibration(owner, tool.id, 10);
  await callApi(owner, 'post', `/api/kit-items/${tool.id}/check-out`, {
    data: { toLocationId: vanId },
    status: 200,
    idempotent: true,
  });
  const customer = await addCustomer(owner, { name: `Householder ${tag}` });
  const site = await addSite(owner, customer.id, { address: `${minutes.length} Mill Leat, Treworgan` });
  const booked = await bookJob(owner, {
    siteId: site.id,
    scheduledOn: isoDaysFromNow(0),
    engineerMemberId: engineer.memberId,
    survey,
    productIds: [],
  });
  for (const [index, m] of minutes.entries())
    await callApi(engineer.session, 'put', `/api/jobs/${booked.job.id}/radiators/${index}/agitation`, {
      data: { minutes: m, kitItemId: tool.id },
    });
}

test('the owner sees each engineer’s daily points and who needs health surveillance', async ({ page, baseURL }) => {
  const { firm, owner, engineer, van } = await firmWithCrew(baseURL!);
  const second = await inviteMember(firm, 'engineer', 'Senara Polglase');
  const van2 = await createVan(owner.session, {
    name: 'Van 2',
    registration: 'HF22 CRN',
    engineerMemberId: second.memberId,
    motDueOn: null,
  });
  // Ellis: 20 + 10 minutes at 10 m/s² on one day = 2 x 100 x 0.5 = 100 points, exactly the action value.
  await agitateToday(owner.session, engineer, van.id, [20, 10]);
  // Senara: 15 minutes = 2 x 100 x 0.25 = 50 points, under it.
  await agitateToday(owner.session, second, van2.id, [15]);

  const register = await callApi<HavRegisterResponse>(owner.session, 'get', '/api/vibration/register?weeks=12');
  const today = register.engineers.find((e) => e.memberId === engineer.memberId)!.weeks.at(-1)!.days[0]?.day;
  expect(today, 'Ellis has a day recorded this week').toBeDefined();
  expect(register.engineers.map((e) => [e.name, e.surveillance, e.highestDayPoints, e.daysOverAction])).toEqual([
    ['Ellis Brannock', 'needed', 100, 1],
    ['Senara Polglase', 'not_indicated', 50, 0],
  ]);
  expect(register.engineers[0]!.weeks.at(-1)!.days).toEqual([{ day: today, points: 100 }]);
  expect([register.actionPoints, register.limitPoints]).toEqual([100, 400]);

  await signIn(page, owner.email, owner.password);
  await mainNav(page).getByRole('link', { name: 'Vibration' }).click();
  await expect(page.getByRole('heading', { name: 'Hand-arm vibration' })).toBeVisible();
  await expect(page.getByText(/100 points is the exposure action value, 400 the limit value/)).toBeVisible();

  const who = page.getByRole('list', { name: 'Who needs action' }).getByRole('listitem');
  await expect(who).toHaveCount(2);
  // The one who needs surveillance comes first.
  const ellis = who.nth(0);
  await expect(ellis).toContainText('Ellis Brannock');
  await expect(ellis).toContainText('Health surveillance needed');
  await expect(ellis).toContainText(
    '1 day at or over the exposure action value of 100 points: health surveillance needed (regulation 7)',
  );
  await expect(ellis).toContainText('1 day with vibration recorded; highest 100 points; 1 at or over 100; 0 over 400.');
  const senara = who.nth(1);
  await expect(senara).toContainText('Senara Polglase');
  await expect(senara).toContainText('Not indicated');
  await expect(senara).not.toContainText('Health surveillance needed');
  await expect(senara).toContainText('Every day under 100 points (highest 50).');

  // The weeks table: this week's column holds each engineer's day.
  const table = page.getByRole('table');
  await expect(table.getByRole('columnheader')).toHaveCount(13);
  const thisWeek = (name: string) =>
    table
      .getByRole('row', { name: new RegExp(name) })
      .getByRole('cell')
      .last();
  await expect(thisWeek('Ellis Brannock')).toHaveText(/^100\s*1 day, 1 ≥ 100$/);
  await expect(thisWeek('Senara Polglase')).toHaveText(/^50\s*1 day$/);
  // An earlier week with nothing recorded shows a dash, not zero.
  await expect(
    table
      .getByRole('row', { name: /Ellis Brannock/ })
      .getByRole('cell')
      .first(),
  ).toHaveText('–');

  // Four weeks: the same day still counts.
  await page.getByRole('radio', { name: '4 weeks' }).check();
  await expect(table.getByRole('columnheader')).toHaveCount(5);
  await expect(thisWeek('Ellis Brannock')).toHaveText(/^100\s*1 day, 1 ≥ 100$/);

  // Each day's points, kept per engineer: the day as a UK date and its points.
  const opener = page.getByText('Points per day for Ellis Brannock');
  expect((await opener.boundingBox())?.height ?? 0).toBeGreaterThanOrEqual(48); // DEVELOPERS.md: 48 px
  await opener.click();
  const ellisDays = page.getByRole('list', { name: 'Points per day, Ellis Brannock' }).getByRole('listitem');
  await expect(ellisDays).toHaveCount(1);
  await expect(ellisDays).toHaveText(/^\d{1,2} [A-Z][a-z]{2} \d{4}: 100 points$/);
});
