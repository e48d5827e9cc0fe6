import type * as z4 from 'zod/v4/core';

/**
 * Field messages in plain words for forms, used where a shared schema gives no message of its
 * own (the schema's own message always wins). Unset numeric inputs arrive as undefined or NaN.
 */
export const plainMessages: z4.ParseContext<z4.$ZodIssue> = {
  error: (issue) => {
    switch (issue.code) {
      case 'invalid_type':
        if (
          issue.input === undefined ||
          issue.input === '' ||
          (typeof issue.input === 'number' && Number.isNaN(issue.input))
        )
          return 'required';
        return issue.expected === 'number' ? 'enter a number' : undefined;
      case 'too_small':
        if (issue.origin === 'string')
          return Number(issue.minimum) <= 1 ? 'required' : `at least ${issue.minimum} characters`;
        if (issue.origin === 'number')
          return `must be ${issue.inclusive ? 'at least' : 'more than'} ${issue.minimum}`;
        if (issue.origin === 'array') return `needs at least ${issue.minimum}`;
        return undefined;
      case 'too_big':
        if (issue.origin === 'string') return `at most ${issue.maximum} characters`;
        if (issue.origin === 'number')
          return `must be ${issue.inclusive ? 'at most' : 'less than'} ${issue.maximum}`;
        if (issue.origin === 'array') return `at most ${issue.maximum}`;
        return undefined;
      case 'invalid_value':
        return 'choose one of the options';
      default:
        return undefined;
    }
  },
};
