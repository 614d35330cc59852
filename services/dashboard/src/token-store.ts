/**
 * The access token, kept in this tab's session storage only (gone when the tab closes; never
 * in a URL or a cookie).
 */
const KEY = 'betasweep.token';

/** The stored token, or null. */
export function loadToken(): string | null {
  try {
    return sessionStorage.getItem(KEY);
  } catch {
    return null;
  }
}

/** Stores (or with null, forgets) the token. */
export function saveToken(token: string | null): void {
  try {
    if (token) sessionStorage.setItem(KEY, token);
    else sessionStorage.removeItem(KEY);
  } catch {
    // Storage disabled: the token lives until the page reloads.
  }
}
