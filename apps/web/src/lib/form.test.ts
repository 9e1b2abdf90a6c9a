import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { firstErrorPerField, idOrNull, textOrNull } from './form';

describe('firstErrorPerField', () => {
  it('keys zod issues by dotted path and keeps the first message of each field', () => {
    const schema = z.object({
      name: z.string().min(1, { error: 'Name is required.' }),
      radiators: z.array(
        z.object({ lengthMm: z.number().min(100, { error: 'Too short.' }).max(4000, { error: 'Too long.' }) }),
      ),
    });
    const result = schema.safeParse({ name: '', radiators: [{ lengthMm: 50 }, { lengthMm: 9000 }] });
    expect(result.success).toBe(false);
    expect(firstErrorPerField(result.error!.issues)).toEqual({
      name: 'Name is required.',
      'radiators.0.lengthMm': 'Too short.',
      'radiators.1.lengthMm': 'Too long.',
    });
  });

  it('reads the API\u2019s 422 details (string paths) the same way, first message winning', () => {
    expect(
      firstErrorPerField([
        { path: 'password', message: 'Password must be at least 12 characters.' },
        { path: 'password', message: 'a second message for the same field' },
        { path: 'email', message: '"x" is not an e-mail address.' },
      ]),
    ).toEqual({ password: 'Password must be at least 12 characters.', email: '"x" is not an e-mail address.' });
  });
});

describe('optional inputs', () => {
  it('an empty select or text box means "not set"', () => {
    expect(idOrNull('')).toBeNull();
    expect(idOrNull(undefined)).toBeNull();
    expect(idOrNull('12')).toBe(12);
    expect(textOrNull('   ')).toBeNull();
    expect(textOrNull('Loft hatch on the landing')).toBe('Loft hatch on the landing');
  });
});
