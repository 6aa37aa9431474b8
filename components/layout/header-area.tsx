import { useRef, useState } from 'react';
import type { View } from 'react-native';

import type { QueryState } from '@/components/state/query-state';
import { useEscapeKey } from '@/hooks/use-escape-key';
import type { LayoutMode } from '@/hooks/use-layout-mode';
import type { MeResponse } from '@/contracts/districts';

import { AccountPanel, AccountStatus } from './account-status';
import { AppHeader } from './app-header';
import { MenuButton, NavMenu, NavStrip } from './main-nav';
import { activeNavKey, navItemsFor } from './nav-items';

export type HeaderAreaProps = {
  mode: LayoutMode;
  pathname: string;
  me: QueryState<MeResponse>;
  /** The server runs the demo stand-ins (so the mailbox exists). */
  demo: boolean;
  unreadAlerts?: number;
  onSignOut: () => void;
  signingOut: boolean;
};

/**
 * Everything above the route: the bar with the mark, the signed-in person and their role;
 * then, wide, the sections as a row of tabs; on a phone, a Menu button that opens them as
 * a panel under the bar (closed again by choosing one, by any change of route, or by Escape,
 * which gives the focus back to the Menu button).
 */
export function HeaderArea({ mode, pathname, me, demo, unreadAlerts, onSignOut, signingOut }: HeaderAreaProps) {
  const [menuOpen, setMenuOpen] = useState(false);
  // Any change of route or layout closes the menu (adjusted while rendering).
  const [menuAt, setMenuAt] = useState({ pathname, mode });
  if (menuAt.pathname !== pathname || menuAt.mode !== mode) {
    setMenuAt({ pathname, mode });
    setMenuOpen(false);
  }
  const menuButton = useRef<View>(null);
  useEscapeKey(menuOpen, () => {
    setMenuOpen(false);
    (menuButton.current as unknown as { focus?: () => void } | null)?.focus?.();
  });
  const items = me.data ? navItemsFor(me.data.role, { demo }) : [];
  const activeKey = activeNavKey(items, pathname);
  const counts = { alerts: unreadAlerts };
  const phone = mode === 'phone';
  return (
    <>
      <AppHeader
        compact={phone}
        account={<AccountStatus me={me} compact={phone} onSignOut={onSignOut} signingOut={signingOut} />}
        menu={
          phone && items.length ? (
            <MenuButton ref={menuButton} open={menuOpen} onPress={() => setMenuOpen((o) => !o)} unread={unreadAlerts} />
          ) : null
        }
      />
      {!phone && items.length ? <NavStrip items={items} activeKey={activeKey} counts={counts} /> : null}
      {phone && menuOpen && items.length ? (
        <NavMenu
          items={items}
          activeKey={activeKey}
          counts={counts}
          onNavigate={() => setMenuOpen(false)}
          account={<AccountPanel me={me} onSignOut={onSignOut} signingOut={signingOut} />}
        />
      ) : null}
    </>
  );
}
