/** Only a path on this site may follow a sign-in (never another host). */
export function safeNext(next: string | null | undefined, fallback = '/home'): string {
  if (!next?.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  return next;
}
