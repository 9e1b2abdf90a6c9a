import { z } from 'zod';

// The safety net behind every schema's own messages (issue 14): where a schema has not said it in the user's words,
// zod's defaults ("Invalid input: expected number, received NaN", "Invalid option: expected one of ...") must not
// reach anyone. This says what is wrong using the field's own name ("heightMm" -> "Height must be a number of
// millimetres"). Schemas still give their own messages; packages/domain/src/lib/schema-messages.test.ts checks both.

/** A field's name as words, with its unit: heightMm -> { name: 'Height', unit: 'millimetres' }. */
const units: [RegExp, string][] = [
  [/Mm$/, 'millimetres'],
  [/Ms2$/, 'm/s²'],
  [/Ml$/, 'millilitres'],
  [/Litres(Per100L)?$/, 'litres'],
  [/Watts$/, 'watts'],
  [/Pence$/, 'pence'],
  [/Days$/, 'days'],
  [/Minutes$/, 'minutes'],
  [/Months$/, 'months'],
  [/(?<=[a-z])M$/, 'metres'],
];

export function fieldWords(path: readonly PropertyKey[]): { name: string; unit: string | null } {
  const key = [...path].reverse().find((p): p is string => typeof p === 'string');
  if (!key) return { name: 'This', unit: null };
  let base = key;
  let unit: string | null = null;
  for (const [pattern, word] of units) {
    if (pattern.test(base) && base.replace(pattern, '') !== '') {
      base = base.replace(pattern, '');
      unit = word;
      break;
    }
  }
  base = base.replace(/(?<=[a-z])Ids?$/, '').replace(/(?<=[a-z])On$/, ' date');
  const words = base
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/_/g, ' ')
    .toLowerCase()
    .trim();
  return { name: words.charAt(0).toUpperCase() + words.slice(1), unit };
}

type Issue = z.core.$ZodRawIssue;

const kindWords: Record<string, string> = {
  string: 'text',
  boolean: 'yes or no',
  array: 'a list',
  object: 'filled in',
  date: 'a date',
  bigint: 'a whole number',
};

/** The fallback message for an issue a schema gave no words for. */
export function userWordsError(issue: Issue): string | undefined {
  const { name, unit } = fieldWords(issue.path ?? []);
  const lower = name === 'This' ? 'an option' : `the ${name.toLowerCase()}`;
  const of = unit ? ` ${unit}` : '';
  switch (issue.code) {
    case 'invalid_type':
      if (issue.input === undefined || issue.input === null) return `${name} is required.`;
      if (issue.expected === 'number' || issue.expected === 'int')
        return unit ? `${name} must be a number of ${unit}.` : `${name} must be a number.`;
      return `${name} must be ${kindWords[issue.expected] ?? 'filled in'}.`;
    case 'invalid_value':
      return `Choose ${lower}.`;
    case 'too_small': {
      const min = Number(issue.minimum);
      if (issue.origin === 'string')
        return min <= 1 ? `${name} is required.` : `${name} needs at least ${min} characters.`;
      if (issue.origin === 'array' || issue.origin === 'set') return `Add at least ${min} to ${lower}.`;
      return `${name} must be ${issue.inclusive === false ? 'more than' : 'at least'} ${min}${of}.`;
    }
    case 'too_big': {
      const max = Number(issue.maximum);
      if (issue.origin === 'string') return `${name} must be at most ${max} characters.`;
      if (issue.origin === 'array' || issue.origin === 'set') return `${name} takes at most ${max}.`;
      return `${name} must be ${issue.inclusive === false ? 'less than' : 'at most'} ${max}${of}.`;
    }
    case 'not_multiple_of':
      return `${name} must be a multiple of ${String(issue.divisor)}${of}.`;
    case 'invalid_format':
      return issue.format === 'email' ? `${name} must be an e-mail address.` : `${name} is not written the right way.`;
    case 'unrecognized_keys':
      return `This form sent something it does not take (${issue.keys.join(', ')}).`;
    case 'invalid_union':
    case 'invalid_key':
    case 'invalid_element':
    case 'custom':
      return `Check ${lower}.`;
    default:
      return undefined;
  }
}

z.config({ customError: userWordsError });

/** Said when no date is given (calendar-date.ts): kept here so importing dates also installs the safety net. */
export const DATE_REQUIRED = 'A date is required.';
