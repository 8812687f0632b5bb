/** What a failed confirmation link's error code means, in words (the auth library's codes, appended to the link's way back). */
export function confirmLinkProblem(code: string): { title: string; why: string } {
  switch (code) {
    case 'TOKEN_EXPIRED':
      return { title: 'This confirmation link has expired', why: 'Confirmation links work for 24 hours after we send them.' };
    case 'INVALID_TOKEN':
      return {
        title: 'This confirmation link does not work',
        why: 'Part of the link may be missing (some mail programs break long links), or it was changed on the way.',
      };
    case 'USER_NOT_FOUND':
      return { title: 'No account waits for this link', why: 'The account it was sent for no longer exists. You can sign up again.' };
    default:
      return { title: 'This confirmation link did not work', why: 'The link could not be checked.' };
  }
}
