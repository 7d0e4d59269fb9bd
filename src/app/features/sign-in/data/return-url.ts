/**
 * The in-app path to go to after signing in. Only paths inside this app are followed, so a
 * crafted link cannot send someone to another site after they sign in.
 */
export function safeReturnUrl(returnUrl: string | null | undefined): string {
  if (!returnUrl || !returnUrl.startsWith('/') || returnUrl.startsWith('//') || returnUrl.startsWith('/\\')) return '/';
  if (returnUrl.startsWith('/sign-in')) return '/';
  return returnUrl;
}
