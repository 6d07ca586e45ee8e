/**
 * Where to go after signing in or up: the `next` query parameter when it is a path on this
 * site (never another host, so a link cannot send people elsewhere), else the desk.
 * e.g. `nextPath('/invitations/abc')` is '/invitations/abc', `nextPath('//evil.example')` is '/desk'.
 */
export function nextPath(next: unknown): string {
  return typeof next === 'string' && next.startsWith('/') && !next.startsWith('//') ? next : '/desk'
}
