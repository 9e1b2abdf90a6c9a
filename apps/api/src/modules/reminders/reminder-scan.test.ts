import { describe, expect, it } from 'vitest';
import { defaultReminderSettings } from '@heatfleet/domain';
import type { FirmToScan } from './reminder-settings-dal.ts';
import { firmIsDueForScan, hourIn } from './reminder-scan.ts';

const firm = (over: Partial<FirmToScan['settings']> = {}, timeZone = 'Europe/London'): FirmToScan => ({
  id: 1,
  name: 'Invented Heating',
  timeZone,
  settings: { ...defaultReminderSettings, lastScanOn: null, ...over },
});

describe('when the sweep scans a firm', () => {
  it('reads the hour in the firm\u2019s zone, British Summer Time included', () => {
    // 06:30 UTC is 07:30 in London in June (BST, UTC+1) and 06:30 in December (GMT).
    expect(hourIn(new Date('2026-06-01T06:30:00Z'), 'Europe/London')).toBe(7);
    expect(hourIn(new Date('2026-12-01T06:30:00Z'), 'Europe/London')).toBe(6);
    expect(hourIn(new Date('2026-12-01T23:30:00Z'), 'Europe/London')).toBe(23);
  });

  it('waits for the scan hour, then scans once a day', () => {
    expect(firmIsDueForScan(firm(), new Date('2026-12-01T06:59:00Z'))).toBe(false);
    expect(firmIsDueForScan(firm(), new Date('2026-12-01T07:00:00Z'))).toBe(true);
    expect(firmIsDueForScan(firm({ lastScanOn: '2026-12-01' }), new Date('2026-12-01T15:00:00Z'))).toBe(false);
    // The worker was down yesterday: today's sweep catches up as soon as the hour has come.
    expect(firmIsDueForScan(firm({ lastScanOn: '2026-11-29' }), new Date('2026-12-01T09:00:00Z'))).toBe(true);
    expect(firmIsDueForScan(firm({ scanHour: 0 }), new Date('2026-12-01T00:00:00Z'))).toBe(true);
  });

  it('uses the firm\u2019s own calendar day, not the server\u2019s', () => {
    // 23:30 UTC on 1 December is already 2 December in Auckland (UTC+13), at 12:30.
    const auckland = firm({ lastScanOn: '2026-12-01' }, 'Pacific/Auckland');
    expect(firmIsDueForScan(auckland, new Date('2026-12-01T23:30:00Z'))).toBe(true);
    expect(
      firmIsDueForScan(
        { ...auckland, settings: { ...auckland.settings, lastScanOn: '2026-12-02' } },
        new Date('2026-12-01T23:30:00Z'),
      ),
    ).toBe(false);
  });
});
