/** Deepest nesting of arrays and objects a JSON body may have; our schemas need well under 10. */
export const MAX_JSON_DEPTH = 64;

/**
 * An `express.json` verify hook that refuses bodies nested deeper than MAX_JSON_DEPTH before
 * they are parsed: a 100 000-deep array parses, but walking it (validation, logging) overflows
 * the stack. Counts brackets outside strings in one pass over the bytes.
 */
export function limitJsonDepth(_req: unknown, _res: unknown, buf: Buffer): void {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < buf.length; i++) {
    const c = buf[i]!;
    if (inString) {
      if (c === 0x5c)
        i++; // backslash: skip the escaped byte
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      if (++depth > MAX_JSON_DEPTH) {
        throw Object.assign(
          new Error(`The request body is nested deeper than ${MAX_JSON_DEPTH} levels.`),
          { status: 400, type: 'entity.too.deep' },
        );
      }
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
}
