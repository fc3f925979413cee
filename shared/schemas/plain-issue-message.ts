import type * as z from 'zod';

/*
 * Every constraint of a schema a person meets (a form, a description file, a request body) carries a sentence
 * of our own next to it. What no single field can word for itself (a missing field, a value of the wrong
 * kind, an unknown key, an option not on the list) is worded here, once, and every edge that checks outside
 * input parses with it (safeParsePlain), so zod's own wording ("Too big: expected number to be <=12") never
 * reaches a person. Messages set on a schema win over these.
 */

const kinds: Record<string, string> = {
  number: 'a number',
  int: 'a whole number',
  string: 'text',
  array: 'a list',
  object: 'an object with named fields',
  boolean: 'true or false',
};

const quoted = (values: readonly unknown[]) => values.map((v) => JSON.stringify(v));

/** Lists values as people do: `"a"`, `"a" or "b"`, `"a", "b" or "c"` (or with `and`). */
function listed(values: readonly unknown[], conjunction: 'or' | 'and' = 'or'): string {
  const words = quoted(values);
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} ${conjunction} ${words.at(-1)}`;
}

function sizeWords(issue: { origin?: string }, bound: number | bigint): string {
  if (issue.origin === 'array' || issue.origin === 'set') return `${bound} ${bound === 1 ? 'entry' : 'entries'}`;
  if (issue.origin === 'string') return `${bound} ${bound === 1 ? 'character' : 'characters'}`;
  return String(bound);
}

/** Our sentence for an issue no schema worded, or undefined to keep the schema's own message. */
export function plainIssueMessage(issue: z.core.$ZodRawIssue): string | undefined {
  switch (issue.code) {
    case 'invalid_type':
      if (issue.input === undefined) return 'This field is required.';
      return `Give ${kinds[issue.expected] ?? `a value of type ${issue.expected}`} here.`;
    case 'unrecognized_keys':
      return issue.keys.length === 1
        ? `"${issue.keys[0]}" is not a field here: check its spelling, or leave it out.`
        : `${listed(issue.keys, 'and')} are not fields here: check their spelling, or leave them out.`;
    case 'invalid_value':
      return `Choose ${listed(issue.values)}.`;
    case 'invalid_union':
      return 'options' in issue && Array.isArray(issue.options) && issue.options.length > 0
        ? `Choose ${listed(issue.options)}.`
        : 'This value has none of the accepted shapes.';
    case 'too_small':
      return `At least ${sizeWords(issue, issue.minimum)}.`;
    case 'too_big':
      return `At most ${sizeWords(issue, issue.maximum)}.`;
    case 'not_multiple_of':
      return `Give a multiple of ${issue.divisor}.`;
    case 'invalid_format':
      return issue.format === 'uuid' ? 'This is not an id of ours; choose from the list.' : `This is not a valid ${issue.format}.`;
    default:
      return undefined;
  }
}

/** safeParse with our sentences for issues the schema does not word itself. */
export function safeParsePlain<S extends z.ZodType>(schema: S, input: unknown): z.ZodSafeParseResult<z.output<S>> {
  return schema.safeParse(input, { error: plainIssueMessage });
}
