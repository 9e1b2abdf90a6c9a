import { describe, expect, it } from 'vitest';
import { firmSettingsInputSchema } from './firm-settings-schemas.ts';

const valid = {
  name: 'Example Heating',
  address: '',
  timeZone: 'Europe/London',
  volumeUnit: 'litres',
  coldBottomThresholdK: 10,
};

describe('firmSettingsInputSchema', () => {
  it('takes an IANA time zone Intl knows and refuses one it does not', () => {
    expect(firmSettingsInputSchema.parse(valid)).toMatchObject({ timeZone: 'Europe/London', address: null });
    expect(
      firmSettingsInputSchema.safeParse({ ...valid, timeZone: 'Europe/Brackenford' }).error?.issues[0]?.message,
    ).toContain('"Europe/Brackenford" is not a time zone');
  });

  it('bounds the cold-bottom threshold to 2-30 K', () => {
    expect(firmSettingsInputSchema.safeParse({ ...valid, coldBottomThresholdK: 2 }).success).toBe(true);
    expect(firmSettingsInputSchema.safeParse({ ...valid, coldBottomThresholdK: 30 }).success).toBe(true);
    expect(firmSettingsInputSchema.safeParse({ ...valid, coldBottomThresholdK: 1.9 }).success).toBe(false);
    expect(firmSettingsInputSchema.safeParse({ ...valid, coldBottomThresholdK: 31 }).success).toBe(false);
  });
});
