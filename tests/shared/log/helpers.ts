import { LogFormatError } from '../../../shared/log/errors';

export const enc = (s: string) => new TextEncoder().encode(s);

/** Runs `fn`, expects a LogFormatError, and returns it for closer checks. */
export function formatError(fn: () => unknown): LogFormatError {
  try {
    fn();
  } catch (err) {
    if (err instanceof LogFormatError) return err;
    throw err;
  }
  throw new Error('expected a LogFormatError, got a result');
}

export async function formatErrorAsync(fn: () => Promise<unknown>): Promise<LogFormatError> {
  try {
    await fn();
  } catch (err) {
    if (err instanceof LogFormatError) return err;
    throw err;
  }
  throw new Error('expected a LogFormatError, got a result');
}
