import { z } from 'zod';

type Issue = z.core.$ZodRawIssue;
type IssueOf<T extends z.core.$ZodIssueBase> = z.core.$ZodRawIssue<T>;

const LIST_LIMIT = 12;

/** How a value reads inside a message: text as typed, anything else as JSON. */
const shown = (value: unknown) => (typeof value === 'string' ? value : JSON.stringify(value));

/** Whether the number schema behind an issue takes whole numbers only (`z.int()`). */
function wantsWholeNumber(issue: IssueOf<z.core.$ZodIssueInvalidType>): boolean {
  return issue.expected === 'int' || (issue.inst as { isInt?: boolean } | undefined)?.isInt === true;
}

function typeMessage(issue: IssueOf<z.core.$ZodIssueInvalidType>): string {
  const missing = issue.input === undefined || issue.input === null;
  if (issue.expected === 'number' || issue.expected === 'int' || issue.expected === 'bigint') {
    return wantsWholeNumber(issue) || issue.expected === 'bigint' ? 'Enter a whole number' : 'Enter a number';
  }
  if (issue.expected === 'boolean') return 'Choose yes or no';
  if (issue.expected === 'array') return 'Give a list';
  if (issue.expected === 'date') return 'Enter a date';
  if (issue.expected === 'never') return 'Unknown field';
  if (missing) return 'Fill this in';
  if (issue.expected === 'string') return 'Enter text';
  return 'Fill this in with the details this field takes';
}

function sizeMessage(issue: IssueOf<z.core.$ZodIssueTooSmall> | IssueOf<z.core.$ZodIssueTooBig>): string {
  const small = issue.code === 'too_small';
  const limit = Number(small ? issue.minimum : issue.maximum);
  const inclusive = issue.inclusive !== false;
  switch (issue.origin) {
    case 'string':
      if (issue.exact) return `Use exactly ${limit} characters`;
      if (small && limit === 1) return 'Fill this in';
      return small ? `Use at least ${limit} characters` : `Use at most ${limit} characters`;
    case 'array':
    case 'set':
      if (small && limit === 1) return 'Choose at least one';
      return small ? `Choose at least ${limit}` : `Choose at most ${limit}`;
    case 'date':
      return small ? 'Choose a later date' : 'Choose an earlier date';
    case 'file':
      return small ? 'The file is empty or too short' : `Use a file of at most ${limit} bytes`;
    default:
      if (small) return inclusive ? `Use ${limit} or more` : `Use more than ${limit}`;
      return inclusive ? `Use ${limit} or less` : `Use less than ${limit}`;
  }
}

const FORMAT_WORDS: Record<string, string> = {
  email: 'Enter a valid e-mail address',
  date: 'Use a date like 2026-03-31',
  datetime: 'Use a date and time like 2026-03-31T14:30:00Z',
  time: 'Use a time like 14:30',
  url: 'Enter a web address',
  regex: 'Use only the characters this field allows',
  json_string: 'Enter valid JSON',
};

function formatMessage(issue: IssueOf<z.core.$ZodIssueInvalidStringFormat>): string {
  if (issue.format === 'starts_with') return `Start with “${String(issue.prefix)}”`;
  if (issue.format === 'ends_with') return `End with “${String(issue.suffix)}”`;
  if (issue.format === 'includes') return `Include “${String(issue.includes)}”`;
  return FORMAT_WORDS[issue.format] ?? 'This is not written the way this field takes it';
}

function valueMessage(values: readonly unknown[]): string {
  if (values.length === 1) return values[0] === '' ? 'Leave this empty' : `Use ${shown(values[0])}`;
  if (values.length > LIST_LIMIT) return 'Pick one from the list';
  return `Pick one of: ${values.map(shown).join(', ')}`;
}

/**
 * A union names what the choice of the value's own kind asked for (a text for a list of texts),
 * else what its last choice asked for: unions list the empty or simple choice first.
 */
function unionMessage(issue: IssueOf<z.core.$ZodIssueInvalidUnion>): string {
  const choices = 'errors' in issue ? issue.errors : [];
  const ofItsKind = choices.find(([first]) => {
    if (!first || first.code === 'invalid_type') return false;
    return first.code !== 'invalid_value' || first.values.some((v) => typeof v === typeof issue.input);
  });
  return (ofItsKind ?? choices.at(-1))?.[0]?.message ?? 'Use a value of the kind this field takes';
}

/**
 * People's words for every zod issue a schema gives no message of its own (zod 4's global error
 * map): never zod's stock "Too small: expected …" or "Invalid input".
 */
export function plainMessage(issue: Issue): string {
  switch (issue.code) {
    case 'invalid_type':
      return typeMessage(issue);
    case 'too_small':
    case 'too_big':
      return sizeMessage(issue);
    case 'invalid_format':
      return formatMessage(issue);
    case 'not_multiple_of':
      return `Use a multiple of ${String(issue.divisor)}`;
    case 'unrecognized_keys':
      return issue.keys.length === 1 ? 'Unknown field' : `Unknown fields: ${issue.keys.join(', ')}`;
    case 'invalid_union':
      return unionMessage(issue);
    case 'invalid_value':
      return valueMessage(issue.values);
    case 'invalid_key':
      return 'Check the names in this list';
    case 'invalid_element':
      return 'Check the entries of this list';
    default:
      return 'Check this value';
  }
}

// Set once wherever the shared schemas are loaded: in the API, its threads and the web app.
z.config({ customError: plainMessage });
