import { readFileSync } from 'node:fs';
import type { z } from 'zod';
import { describePlace } from '../../shared/log/errors';
import { RefusedInput } from './exit-codes';

/** 1-based line and column of a character offset, as an editor shows them. */
function place(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  return { line, column: offset - (before.lastIndexOf('\n') + 1) + 1 };
}

/**
 * Reads and validates a small JSON file named on the command line (`path` as typed, `resolved`
 * on disk); a file that cannot be opened or used is refused input, placed by line and column.
 */
export function readJson<T>(path: string, resolved: string, schema: z.ZodType<T>, what: string): T {
  let text: string;
  try {
    text = readFileSync(resolved, 'utf8');
  } catch (err) {
    throw new RefusedInput(`Cannot open the ${what} file ${path}: ${(err as Error).message}`, {
      cause: err,
    });
  }
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (err) {
    const msg = (err as Error).message;
    const pos = /position (\d+)/.exec(msg);
    const at = pos ? place(text, Number(pos[1])) : { line: 1, column: 1 };
    throw new RefusedInput(
      `${path}: ${describePlace(at.line, at.column)}: not valid JSON (${msg}).`,
    );
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    const key = issue.path[issue.path.length - 1];
    // Point at the offending key when it appears once in the text.
    const needle = typeof key === 'string' ? `"${key}"` : null;
    const idx = needle ? text.indexOf(needle) : -1;
    const at =
      idx >= 0 && text.indexOf(needle!, idx + 1) < 0 ? place(text, idx) : { line: 1, column: 1 };
    throw new RefusedInput(
      `${path}: ${describePlace(at.line, at.column)}: not a usable ${what}: ` +
        `${issue.path.join('.') || '(top level)'}: ${issue.message}.`,
    );
  }
  return parsed.data;
}
