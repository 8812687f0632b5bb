/** Only a path on this site, and never back to a sign-in page, so ?next= cannot send anyone elsewhere. */
export function safeNextPath(next: string | null | undefined, fallback = '/'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (/^\/(sign-in|sign-up|forgot-password|reset-password)(\/|\?|$)/.test(next)) return fallback;
  return next;
}

/** A sign-in link that brings the person back to where they are. */
export const signInHref = (here: string) => (here === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(here)}`);

/**
 * Where sign-in sends someone: back to the page they asked for (a `?next=` other than the shop home), else to the
 * workspace their role works in (`home`).
 */
export function landingPath(next: string | null | undefined, home: string): string {
  const asked = safeNextPath(next, '/');
  return asked === '/' ? home : asked;
}
