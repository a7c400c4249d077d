import { multilineText, optionalText, plainMessage, text } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';

/** Zod's stock wording, which never reaches a person. */
const STOCK = /expected|invalid input|invalid option|>=|<=|too small|too big|unrecognized key/i;

const messageOf = (schema: z.ZodType, value: unknown) => {
  const result = schema.safeParse(value);
  if (result.success) throw new Error(`${JSON.stringify(value)} passed`);
  return result.error.issues[0]!.message;
};

const LETTERS = 'abcdefghijklm'.split('');

describe('the shared error map', () => {
  it.each([
    ['invalid_type: nothing sent for text', z.string(), undefined, 'Fill this in'],
    ['invalid_type: a number for text', z.string(), 5, 'Enter text'],
    ['invalid_type: text for a number', z.number(), 'x', 'Enter a number'],
    ['invalid_type: a fraction for a whole number', z.int(), 1.5, 'Enter a whole number'],
    ['invalid_type: text for a whole number', z.int(), 'x', 'Enter a whole number'],
    ['invalid_type: text for a whole number read from a query', z.coerce.number().int(), 'first', 'Enter a whole number'],
    ['invalid_type: text for a large whole number', z.bigint(), 'x', 'Enter a whole number'],
    ['invalid_type: text for yes or no', z.boolean(), 'yes', 'Choose yes or no'],
    ['invalid_type: text for a list', z.array(z.string()), 'x', 'Give a list'],
    ['invalid_type: text for a date', z.date(), 'x', 'Enter a date'],
    ['invalid_type: text for a group of fields', z.object({}), 'x', 'Fill this in with the details this field takes'],
    ['too_small: empty text', z.string().min(1), '', 'Fill this in'],
    ['too_small: short text', z.string().min(3), 'ab', 'Use at least 3 characters'],
    ['too_small: text of an exact length', z.string().length(3), 'ab', 'Use exactly 3 characters'],
    ['too_small: a number below the least', z.int().min(1), 0, 'Use 1 or more'],
    ['too_small: a number not above the bound', z.int().positive(), 0, 'Use more than 0'],
    ['too_small: an empty list', z.array(z.int()).min(1), [], 'Choose at least one'],
    ['too_small: a short list', z.array(z.int()).min(2), [1], 'Choose at least 2'],
    ['too_small: an early date', z.date().min(new Date('2020-01-01')), new Date('2019-01-01'), 'Choose a later date'],
    ['too_big: long text', z.string().max(120), 'n'.repeat(121), 'Use at most 120 characters'],
    ['too_big: a number above the most', z.number().max(10), 11, 'Use 10 or less'],
    ['too_big: a number not below the bound', z.number().lt(10), 10, 'Use less than 10'],
    ['too_big: a long list', z.array(z.int()).max(2), [1, 2, 3], 'Choose at most 2'],
    ['too_big: a late date', z.date().max(new Date('2020-01-01')), new Date('2021-01-01'), 'Choose an earlier date'],
    ['invalid_format: e-mail', z.email(), 'someone', 'Enter a valid e-mail address'],
    ['invalid_format: date', z.iso.date(), '2026-13-01', 'Use a date like 2026-03-31'],
    ['invalid_format: date and time', z.iso.datetime(), 'soon', 'Use a date and time like 2026-03-31T14:30:00Z'],
    ['invalid_format: web address', z.url(), 'here', 'Enter a web address'],
    ['invalid_format: pattern', z.string().regex(/^[a-z]+$/), 'A1', 'Use only the characters this field allows'],
    ['invalid_format: start', z.string().startsWith('DEN-'), 'x', 'Start with “DEN-”'],
    ['invalid_format: other forms', z.uuid(), 'x', 'This is not written the way this field takes it'],
    ['not_multiple_of', z.number().multipleOf(5), 3, 'Use a multiple of 5'],
    ['unrecognized_keys: one', z.strictObject({}), { a: 1 }, 'Unknown field'],
    ['unrecognized_keys: several', z.strictObject({}), { a: 1, b: 2 }, 'Unknown fields: a, b'],
    ['invalid_union: names the last choice', z.union([z.literal(''), z.email()]), 5, 'Enter text'],
    ['invalid_union: names the choice of the value’s kind', z.union([z.enum(['van', 'suv']), z.array(z.enum(['van', 'suv']))]), 'boat', 'Pick one of: van, suv'],
    ['invalid_union: no choice named', z.discriminatedUnion('k', [z.object({ k: z.literal('a') }), z.object({ k: z.literal('b') })]), { k: 'c' }, 'Use a value of the kind this field takes'],
    ['invalid_value: a short list', z.enum(['van', 'suv']), 'boat', 'Pick one of: van, suv'],
    ['invalid_value: a long list', z.enum(LETTERS as [string, ...string[]]), 'z', 'Pick one from the list'],
    ['invalid_value: one value', z.literal('yes'), 'no', 'Use yes'],
    ['invalid_value: the empty text', z.literal(''), 'x', 'Leave this empty'],
    ['invalid_key', z.record(z.string().min(2), z.int()), { a: 1 }, 'Check the names in this list'],
    ['custom without a message', z.string().refine(() => false), 'a', 'Check this value'],
  ])('words %s in plain words', (_kind, schema, value, message) => {
    const words = messageOf(schema, value);
    expect(words).toBe(message);
    expect(words).not.toMatch(STOCK);
  });

  it('leaves a schema’s own message alone', () => {
    expect(messageOf(z.string().min(1, 'Enter a name'), '')).toBe('Enter a name');
    expect(messageOf(z.int({ error: 'Choose a location' }), 'x')).toBe('Choose a location');
  });

  it('answers an issue handed to it directly, as the API and the web receive it', () => {
    expect(plainMessage({ code: 'too_big', origin: 'string', maximum: 60, inclusive: true, input: 'x' })).toBe('Use at most 60 characters');
  });
});

const CONTROL = 'Take out the invisible control characters (such as NUL) pasted into this text';

describe('the text helpers', () => {
  it('trims, refuses blank text where it is required, and counts characters after trimming', () => {
    expect(text(5).parse('  Orla  ')).toBe('Orla');
    expect(messageOf(text(5), '   ')).toBe('Fill this in');
    expect(messageOf(text(5, 'Enter a name'), '\t \n')).toBe('Enter a name');
    expect(text(5).parse(`  ${'a'.repeat(5)}  `)).toBe('aaaaa');
    expect(messageOf(text(5), 'a'.repeat(6))).toBe('Use at most 5 characters');
    expect(optionalText(5).parse('   ')).toBe('');
    expect(multilineText(5).parse('')).toBe('');
    expect(messageOf(multilineText(5, 'Say why'), '  ')).toBe('Say why');
  });

  it.each([
    ['NUL', 'a\u0000b'],
    ['a bell', 'a\u0007b'],
    ['an escape', 'a\u001bb'],
    ['DEL', 'a\u007fb'],
    ['a C1 next-line', 'a\u0085b'],
    ['a C1 control', 'a\u009bb'],
    ['half a surrogate pair', 'a\ud800b'],
  ])('refuses %s in every kind of text', (_label, value) => {
    expect(messageOf(text(20), value)).toBe(CONTROL);
    expect(messageOf(optionalText(20), value)).toBe(CONTROL);
    expect(messageOf(multilineText(20), value)).toBe(CONTROL);
  });

  it('keeps line breaks and tabs in text of several lines only', () => {
    expect(multilineText(40).parse('Fuse blown\r\n\tcable chafed')).toBe('Fuse blown\r\n\tcable chafed');
    expect(messageOf(text(40), 'Orla\nFenwick')).toBe('Keep this to one line');
    expect(messageOf(optionalText(40), 'Orla\rFenwick')).toBe('Keep this to one line');
    expect(messageOf(text(40), 'Orla\tFenwick')).toBe('Take out the tab characters');
  });

  it('takes letters of every script, emoji and marks', () => {
    expect(text(40).parse('Zoë Ångström 🚐 — “van”')).toBe('Zoë Ångström 🚐 — “van”');
  });
});
