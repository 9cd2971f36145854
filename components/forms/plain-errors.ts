/**
 * Zod's fallback messages ("Invalid input: expected number, received NaN") are not for people at a
 * bench. The contracts give most fields their own words; this fills in the rest plainly.
 */
type Issue = {
  code: string;
  expected?: string;
  input?: unknown;
  origin?: string;
  minimum?: number | bigint;
  maximum?: number | bigint;
  inclusive?: boolean;
  format?: string;
};

export function plainIssue(iss: Issue): string | undefined {
  switch (iss.code) {
    case 'invalid_type':
      if (iss.expected === 'number')
        return iss.input === undefined || iss.input === null
          ? 'enter a number'
          : 'enter a number, using a point for decimals';
      if (iss.input === undefined || iss.input === null) return 'fill this in';
      return 'this is not the right kind of value';
    case 'too_small':
      if (iss.origin === 'string')
        return Number(iss.minimum) <= 1 ? 'fill this in' : `use at least ${iss.minimum} characters`;
      if (iss.origin === 'array') return Number(iss.minimum) <= 1 ? 'add at least one' : `add at least ${iss.minimum}`;
      return iss.inclusive ? `must be ${iss.minimum} or more` : `must be more than ${iss.minimum}`;
    case 'too_big':
      if (iss.origin === 'string') return `keep it to ${iss.maximum} characters`;
      if (iss.origin === 'array') return `at most ${iss.maximum}`;
      return iss.inclusive ? `must be ${iss.maximum} or less` : `must be less than ${iss.maximum}`;
    case 'invalid_format':
      return iss.format === 'email' ? 'enter an e-mail address like name@example.com' : 'check how this is written';
    case 'invalid_value':
      return 'choose one of the options';
    default:
      return undefined;
  }
}

/** Parse options for zodResolver: our plain words where the schema gives none. */
export const plainParse = { error: (iss: Issue) => plainIssue(iss) } as const;
