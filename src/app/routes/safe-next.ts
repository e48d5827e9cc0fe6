/** Only same-app paths are followed after sign-in, so a crafted link cannot send people elsewhere. */
export function safeNext(next: string | null, fallback = '/'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\'))
    return fallback;
  return next;
}
