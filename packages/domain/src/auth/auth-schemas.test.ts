import { describe, expect, it } from 'vitest';
import { emailSchema, passwordSchema, signUpInputSchema } from './auth-schemas.ts';

describe('passwordSchema', () => {
  // OWASP Authentication Cheat Sheet / NIST SP 800-63B: length limits, no composition rules.
  it.each([
    ['x'.repeat(11), false],
    ['x'.repeat(12), true],
    ['all lower case words', true],
    ['x'.repeat(128), true],
    ['x'.repeat(129), false],
  ])('%s -> %s', (pw, ok) => {
    expect(passwordSchema.safeParse(pw).success).toBe(ok);
  });

  it('does not trim what the person typed', () => {
    expect(passwordSchema.parse('  twelve chars  ')).toBe('  twelve chars  ');
  });
});

describe('emailSchema', () => {
  it('trims and lower-cases, so one address is one account', () => {
    expect(emailSchema.parse('  Owner@Brackenford.Example ')).toBe('owner@brackenford.example');
  });
  it('quotes the value in its message when it is not an address', () => {
    const r = emailSchema.safeParse('not-an-address');
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.message).toBe('"not-an-address" is not an e-mail address.');
  });
});

describe('signUpInputSchema', () => {
  it('refuses unknown fields and objects in place of strings', () => {
    expect(
      signUpInputSchema.safeParse({
        firmName: 'Ab',
        name: 'A',
        email: 'a@b.example',
        password: 'x'.repeat(12),
        role: 'owner',
      }).success,
    ).toBe(false);
    expect(
      signUpInputSchema.safeParse({ firmName: { $ne: 1 }, name: 'A', email: 'a@b.example', password: 'x'.repeat(12) })
        .success,
    ).toBe(false);
  });
});
