/** A message at the top of the start page, and how it should look. */
export interface SignInNotice {
  readonly text: string;
  readonly tone: 'info' | 'problem';
}

/** What the API's `?signin=` failure reasons mean to a person; other reasons are shown as sent. */
const FAILURES: Readonly<Record<string, string>> = {
  'no-account':
    'That sign-in worked, but the address is not a member of any firm on Latchwork yet. Ask your firm’s owner to invite you.',
  failed: 'Signing in did not complete. Please try again.',
  access_denied: 'Signing in was cancelled. Sign in again when you are ready.',
};

/**
 * The one notice the start page shows, most pressing first: a session that just ended, a
 * sign-in that failed, or a page that needs signing in.
 */
export function signInNotice(state: {
  sessionEnded: boolean;
  failure: string | null;
  returnTo: string | null;
}): SignInNotice | null {
  if (state.sessionEnded) {
    return { text: 'Your session has ended. Sign in again to carry on.', tone: 'info' };
  }
  if (state.failure) {
    const known = FAILURES[state.failure];
    return {
      text: known ?? `Signing in did not complete: ${state.failure.slice(0, 200)}`,
      tone: 'problem',
    };
  }
  if (state.returnTo) {
    return { text: 'Sign in to open that page.', tone: 'info' };
  }
  return null;
}
