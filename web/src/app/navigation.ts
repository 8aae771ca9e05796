import type { Role } from '@shuntwise/contracts';

/** The groups the navigation shows, in order. */
export const SCREEN_GROUPS = [
  { key: 'qualify', label: 'Qualify' },
  { key: 'design', label: 'Design' },
  { key: 'procure', label: 'Procure' },
  { key: 'administer', label: 'Administer' },
] as const;
export type ScreenGroup = (typeof SCREEN_GROUPS)[number]['key'];

export interface Screen {
  key: string;
  path: string;
  label: string;
  group: ScreenGroup;
  /** Roles that may open the screen; the API enforces the same per route. */
  roles: readonly Role[];
}

/**
 * The one map of which role sees which screen. The navigation, the route guard and
 * the landing page after sign-in all read it; a new screen is one line here plus its
 * route file.
 */
export const SCREENS = [
  { key: 'board', path: '/board', label: 'Board', group: 'qualify', roles: ['admin', 'engineer'] },
  { key: 'house-parts', path: '/house-parts', label: 'House parts', group: 'qualify', roles: ['admin', 'engineer'] },
  { key: 'vendor-parts', path: '/vendor-parts', label: 'Vendor parts', group: 'qualify', roles: ['admin', 'engineer'] },
  { key: 'qualifications', path: '/qualifications', label: 'Qualifications', group: 'qualify', roles: ['admin', 'engineer'] },
  { key: 'find', path: '/find', label: 'Find parts', group: 'design', roles: ['admin', 'engineer', 'designer'] },
  { key: 'sources', path: '/sources', label: 'Sources', group: 'procure', roles: ['admin', 'engineer', 'buyer'] },
  { key: 'outbox', path: '/outbox', label: 'Outbox', group: 'administer', roles: ['admin'] },
  { key: 'users', path: '/users', label: 'Users', group: 'administer', roles: ['admin'] },
] as const satisfies readonly Screen[];

export type ScreenKey = (typeof SCREENS)[number]['key'];

export function screenByKey(key: ScreenKey): Screen {
  return SCREENS.find((s) => s.key === key)!;
}

export function mayUse(role: Role, screen: Screen): boolean {
  return screen.roles.includes(role);
}

export function screensFor(role: Role): Screen[] {
  return SCREENS.filter((s) => mayUse(role, s));
}

/** Where a role lands after sign-in: its first screen. */
export function homePathFor(role: Role): string {
  return screensFor(role)[0]?.path ?? '/';
}

/** Pages outside every screen's own path, with the screen whose roles they share. */
const PAGES_OF_SCREENS: ReadonlyArray<{ prefix: string; screen: ScreenKey }> = [{ prefix: '/compare/', screen: 'board' }];

/** The screen a path belongs to (`/house-parts/12` → House parts, `/compare/3` → Board), if any. */
export function screenForPath(pathname: string): Screen | undefined {
  const own = SCREENS.find((s) => pathname === s.path || pathname.startsWith(`${s.path}/`));
  if (own) return own;
  const page = PAGES_OF_SCREENS.find((p) => pathname.startsWith(p.prefix));
  return page ? screenByKey(page.screen) : undefined;
}

/**
 * Where to go after sign-in: back to the page the user was sent away from, when the
 * role may use it and it is a path inside the app (never an outside URL); else home.
 */
export function landingPathFor(role: Role, next: string | null): string {
  if (next && next.startsWith('/') && !next.startsWith('//')) {
    const screen = screenForPath(next.split(/[?#]/)[0]);
    if (screen && mayUse(role, screen)) return next;
  }
  return homePathFor(role);
}
