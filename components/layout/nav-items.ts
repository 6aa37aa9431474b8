// The app's sections, in the order the navigation shows them, and which roles see each.
// Hiding a section is a courtesy: the server refuses its calls to other roles anyway.
import type { Href } from '@/lib/router';

import { can, type Capability } from '@/lib/roles';

export type NavItem = {
  key: string;
  label: string;
  href: Href;
  /** Whether the current path belongs to this section (for the "you are here" mark). */
  matches: (pathname: string) => boolean;
};

type Entry = NavItem & { need: Capability; demoOnly?: boolean };

const under =
  (...roots: string[]) =>
  (p: string) =>
    roots.some((r) => p === r || p.startsWith(`${r}/`));

const ENTRIES: readonly Entry[] = [
  { key: 'region', label: 'Region', href: '/', need: 'read', matches: (p) => p === '/' || under('/district')(p) },
  { key: 'alerts', label: 'Alerts', href: '/alerts', need: 'read', matches: under('/alerts', '/subscriptions') },
  { key: 'runs', label: 'Runs', href: '/runs', need: 'runs', matches: under('/runs') },
  { key: 'uploads', label: 'Uploads', href: '/uploads', need: 'upload', matches: under('/uploads') },
  { key: 'specs', label: 'Specs', href: '/specs', need: 'specs', matches: under('/specs') },
  { key: 'people', label: 'People', href: '/people', need: 'people', matches: under('/people') },
  { key: 'settings', label: 'Settings', href: '/settings', need: 'settings.write', matches: under('/settings') },
  { key: 'audit', label: 'Audit', href: '/audit', need: 'audit', matches: under('/audit') },
  {
    key: 'mailbox',
    label: 'Mailbox (demo)',
    href: '/mailbox',
    need: 'mailbox',
    demoOnly: true,
    matches: under('/mailbox'),
  },
  { key: 'method', label: 'Method', href: '/method', need: 'read', matches: under('/method') },
];

/**
 * The sections a role sees. `demo`: the server runs with the local sign-in stand-in and
 * mail catcher, so the mailbox exists.
 */
export function navItemsFor(role: string | null | undefined, { demo }: { demo: boolean }): NavItem[] {
  return ENTRIES.filter((e) => can(role, e.need) && (!e.demoOnly || demo)).map(({ key, label, href, matches }) => ({
    key,
    label,
    href,
    matches,
  }));
}

/** The section the path belongs to, if any. */
export function activeNavKey(items: readonly NavItem[], pathname: string): string | null {
  return items.find((i) => i.matches(pathname))?.key ?? null;
}

/** Routes that keep the district list beside them when wide: the region and its districts. */
export function isRegionRoute(pathname: string): boolean {
  return pathname === '/' || pathname.startsWith('/district/');
}
