import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import * as domain from '../index.ts';
import { userWordsError } from './zod-messages.ts';

// Issue 14: no zod default message ("Invalid input: expected number, received NaN", "Invalid option: expected one
// of ...") reaches a user. This walks every schema the domain exports that takes input (answers the server builds
// are left out by name), feeds each field, nested ones included, wrong types, empty and out-of-range values, and
// fails on any default message. Wording: GOV.UK Design System, "Error message" ("say what has happened and how to
// fix it", e.g. "Enter ...", "Choose ..."), common practice (no source) for the exact sentences.

const ZOD_DEFAULT =
  /^(Invalid input|Invalid option|Invalid string|Invalid number|Invalid email|Invalid UUID|Invalid URL|Invalid date|Invalid element|Invalid key|Invalid ISO|Invalid type|Unrecognized key|Too big:|Too small:|Required$|Expected )/;

/** Shapes the server builds and the client only parses: never fed by a person. */
const isAnswer = (name: string) => /(Response|Envelope)Schema$/.test(name) || answerShapes.has(name);
const answerShapes = new Set([
  'userSchema',
  'membershipSchema',
  'firmSchema',
  'itemKindSchema',
  'inspectionDueSchema',
  'kitItemSchema',
  'kitSchema',
  'custodyEventSchema',
  'inspectionSchema',
  'kitLabelSchema',
  'locationRefSchema',
  'vanSchema',
  'depotSchema',
  'memberSchema',
  'invitationSchema',
  'invitationPreviewSchema',
  'outboxMessageSummarySchema',
  'outboxMessageSchema',
  'overviewVanSchema',
  'overviewDueItemSchema',
  'havEngineerSchema',
  'overviewSchema',
  'photoSchema',
  'reminderDeliverySchema',
  'reminderSettingsViewSchema',
  'unsubscribePreviewSchema',
  'marketingSuppressionSchema',
  'customerPageSiteSchema',
  'customerSchema',
  'customerSiteBriefSchema',
  'customerSiteSchema',
  'customerDetailSchema',
  'newSiteSchema',
  'siteListRowSchema',
  'siteCheckSchema',
  'checkableInhibitorSchema',
  'siteJobSchema',
  'siteDetailSchema',
  'productSchema',
  'movementSchema',
  'jobDetailSchema',
  'suggestedLinesSchema',
]);

const BAD: unknown[] = [
  undefined,
  null,
  '',
  '   ',
  'abc',
  -1,
  0,
  0.5,
  1e12,
  Number.NaN,
  true,
  [],
  {},
  'x'.repeat(5001),
  '2026-13-45',
];

type Schema = z.ZodType;
const def = (s: Schema) => (s as unknown as { _zod: { def: Record<string, unknown> } })._zod.def;

/** The object shape or array element inside wrappers (optional, nullable, default, pipe), if any. */
function inner(s: Schema): Schema {
  const d = def(s);
  if (['optional', 'nullable', 'default', 'prefault', 'readonly', 'catch', 'nonoptional'].includes(d.type as string))
    return inner(d.innerType as Schema);
  if (d.type === 'pipe') return inner(d.in as Schema);
  return s;
}

/** Every input that puts one bad value at one place in the schema (top level, each field, each nested field). */
function badInputs(s: Schema, depth = 0): unknown[] {
  const out: unknown[] = [...BAD];
  if (depth > 4) return out;
  const core = inner(s);
  const d = def(core);
  if (d.type === 'object') {
    out.push({ notAField: 1 });
    for (const [key, field] of Object.entries(d.shape as Record<string, Schema>))
      for (const value of badInputs(field, depth + 1)) out.push({ [key]: value });
  } else if (d.type === 'array') {
    for (const value of badInputs(d.element as Schema, depth + 1)) out.push([value]);
  }
  return out;
}

function messagesOf(s: Schema): { path: string; message: string }[] {
  const found: { path: string; message: string }[] = [];
  for (const input of badInputs(s)) {
    const result = s.safeParse(input);
    if (!result.success)
      for (const issue of result.error.issues) found.push({ path: issue.path.join('.'), message: issue.message });
  }
  return found;
}

const inputSchemas = Object.entries(domain as Record<string, unknown>).filter(
  (entry): entry is [string, Schema] => entry[1] instanceof z.ZodType && !isAnswer(entry[0]),
);

describe('every schema speaks the user\u2019s words', () => {
  it('finds the input schemas (a check that the walk walks something)', () => {
    expect(inputSchemas.length).toBeGreaterThan(60);
    expect(inputSchemas.map(([name]) => name)).toEqual(
      expect.arrayContaining(['checkInInputSchema', 'surveySchema', 'receiptInputSchema', 'customerPageQuerySchema']),
    );
  });

  it.each(inputSchemas)(
    '%s gives no zod default message for wrong, empty or out-of-range values',
    (_name, schema) => {
      const defaults = messagesOf(schema).filter((m) => ZOD_DEFAULT.test(m.message) || m.message.trim() === '');
      expect([...new Set(defaults.map((m) => `${m.path || '(whole)'}: ${m.message}`))]).toEqual([]);
    },
    30_000,
  );
});

describe('the messages people met, in their words', () => {
  const first = (schema: Schema, input: unknown) => {
    const result = schema.safeParse(input);
    return result.success ? null : result.error.issues[0]!.message;
  };

  it('says to choose the condition rather than listing the options', () => {
    expect(first(domain.itemConditionSchema, 'broken')).toBe('Choose the condition.');
    expect(first(domain.itemConditionSchema, undefined)).toBe('Choose the condition.');
  });

  it('asks for a radiator\u2019s height in millimetres, not "expected number, received NaN"', () => {
    const radiator = { room: 'Lounge', panel: 'double' };
    expect(first(domain.surveyRadiatorSchema, { ...radiator, heightMm: Number.NaN })).toBe(
      'Height must be a number of millimetres.',
    );
    expect(first(domain.surveyRadiatorSchema, { ...radiator, heightMm: 50 })).toBe(
      'Height must be at least 100 millimetres.',
    );
    expect(first(domain.surveyRadiatorSchema, { ...radiator, panel: 'triple' })).toBe('Choose the panel type.');
  });

  it('names the field and its unit in the safety net (a field a schema gave no words of its own)', () => {
    const probe = z.strictObject({ lengthMm: z.number().min(100), vanId: z.number(), kind: z.enum(['a', 'b']) });
    const messages = probe
      .safeParse({ lengthMm: 'ten', vanId: 'x', kind: 'c', extra: 1 })
      .error!.issues.map((i) => i.message);
    expect(messages).toEqual([
      'Length must be a number of millimetres.',
      'Van must be a number.',
      'Choose the kind.',
      'This form sent something it does not take (extra).',
    ]);
  });
});

describe('without the safety net', () => {
  // The schemas the issue names carry their own words, so they read the same even if the fallback were removed.
  beforeAll(() => z.config({ customError: undefined }));
  afterAll(() => z.config({ customError: userWordsError }));
  it.each([
    ['itemConditionSchema', 'broken'],
    ['checkInInputSchema', { toLocationId: 1, condition: 'broken' }],
    ['surveyRadiatorSchema', { room: 'Hall', panel: 'double', heightMm: Number.NaN }],
  ] as const)('%s has its own message', (name, input) => {
    const schema = domain[name] as Schema;
    const result = schema.safeParse(input);
    expect(result.success).toBe(false);
    for (const issue of result.error!.issues) expect(issue.message).not.toMatch(ZOD_DEFAULT);
  });
});
