import { describe, expect, it } from 'vitest';
import { reminderDigestEmail } from './reminder-email.ts';

const link = 'http://localhost/reminders';

describe('the reminder digest', () => {
  it('groups lines under headings in a fixed order and names what it covers in the subject', () => {
    const digest = reminderDigestEmail({
      firmName: 'Invented Heating',
      audience: { kind: 'office' },
      link,
      lines: [
        {
          kind: 'batch_expiring',
          summary: 'Cleaner lot A1: expires on 2027-01-01 (in 31 days); 2 packs held: Depot 2',
        },
        { kind: 'inspection_due', summary: 'H-1 (Hose set): inspection due by 2026-12-05' },
        { kind: 'van_below_minimum', summary: 'Van-1: Cleaner 0 usable, under its minimum of 1 (target 2)' },
        {
          kind: 'depot_reorder',
          summary:
            'Cleaner at Depot: 1 usable, under its minimum of 4; order 7 packs to reach 8 (none used in the last 90 days)',
        },
      ],
    });
    expect(digest.subject).toBe('Invented Heating: 4 reminders for kit and stock');
    const headings = digest.text.split('\n').filter((l) => l.endsWith(':') && !l.startsWith('- '));
    expect(headings).toEqual([
      'Kit due for inspection:',
      'Vans below their minimum stock:',
      'Depot stock to reorder:',
      'Batches expiring:',
    ]);
    expect(digest.html).toContain('<h3>Depot stock to reorder</h3>');
  });

  it('keeps the fleet-only subject as it was', () => {
    const digest = reminderDigestEmail({
      firmName: 'Invented Heating',
      audience: { kind: 'office' },
      link,
      lines: [{ kind: 'mot_due', summary: 'Van-1: MOT due on 2026-12-20' }],
    });
    expect(digest.subject).toBe('Invented Heating: 1 reminder for vans');
    const all = reminderDigestEmail({
      firmName: 'Invented Heating',
      audience: { kind: 'office' },
      link,
      lines: [
        { kind: 'mot_due', summary: 'Van-1: MOT due on 2026-12-20' },
        { kind: 'inspection_due', summary: 'H-1 (Hose set): inspection due by 2026-12-05' },
        { kind: 'depot_reorder', summary: 'Cleaner at Depot: 1 usable' },
      ],
    });
    expect(all.subject).toBe('Invented Heating: 3 reminders for kit, vans and stock');
  });
});
