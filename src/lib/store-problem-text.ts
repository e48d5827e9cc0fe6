/** Why the store refused, in words a pilot can act on. */
export function storeProblemText(error: unknown): string {
  const e = error as { name?: unknown; message?: unknown; inner?: { name?: unknown } } | null;
  const names = [e?.name, e?.inner?.name];
  if (names.includes('MissingAPIError'))
    return 'this browser offers no storage to the site (a private window, or site data blocked)';
  if (names.includes('QuotaExceededError'))
    return 'the device has no room left for this site’s data';
  if (names.includes('SecurityError')) return 'the browser’s settings block storage for this site';
  const detail = typeof e?.message === 'string' && e.message ? e.message : String(error);
  return `the browser refused its storage (${detail})`;
}
