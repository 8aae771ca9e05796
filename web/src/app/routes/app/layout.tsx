import '@mantine/notifications/styles.css';

import { useEffect, type ComponentType } from 'react';
import { AppShell, Box, Burger, Button, Group, NavLink, ScrollArea, Stack, Text } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { Notifications } from '@mantine/notifications';
import {
  IconBuildingFactory2,
  IconClipboardCheck,
  IconLayoutGrid,
  IconLogout,
  IconMailOpened,
  IconPackage,
  IconSearch,
  IconTruckDelivery,
  IconUsers,
  type IconProps,
} from '@tabler/icons-react';
import { Link, Outlet, useLocation } from 'react-router';
import { SCREEN_GROUPS, screensFor, type ScreenKey } from '@/app/navigation';
import { QueryProvider } from '@/app/query-provider';
import { Brand } from '@/components/brand';
import { ColorSchemeToggle } from '@/components/color-scheme-toggle';
import { RoleBadge } from '@/components/role-badge';
import { useMe } from '@/features/auth/api/get-me';
import { useLogout } from '@/features/auth/api/logout';
import { updateSessionUser, useSession } from '@/lib/session';
import classes from './layout.module.css';

const ICONS: Record<ScreenKey, ComponentType<IconProps>> = {
  board: IconLayoutGrid,
  'house-parts': IconBuildingFactory2,
  'vendor-parts': IconPackage,
  qualifications: IconClipboardCheck,
  find: IconSearch,
  sources: IconTruckDelivery,
  outbox: IconMailOpened,
  users: IconUsers,
};

export function AppLayout() {
  return (
    <QueryProvider>
      <SignedInShell />
    </QueryProvider>
  );
}

function SignedInShell() {
  const session = useSession();
  const location = useLocation();
  const [opened, { toggle, close }] = useDisclosure(false);
  const logout = useLogout();
  // The stored user may be stale (an admin changed the role): the server's word wins.
  const me = useMe(session !== null);
  useEffect(() => {
    if (me.data) updateSessionUser(me.data);
  }, [me.data]);

  useEffect(close, [location.pathname, close]);

  if (!session) return null;
  const { user } = session;
  const screens = screensFor(user.role);
  // A role with one screen needs no navigation: the page gets the whole width, the header the account.
  const single = screens.length <= 1;
  const signOut = (
    <Button variant="default" size="xs" leftSection={<IconLogout size={14} />} loading={logout.isPending} onClick={() => logout.mutate()}>
      Sign out
    </Button>
  );

  return (
    <AppShell header={{ height: 52 }} navbar={single ? undefined : { width: 232, breakpoint: 'sm', collapsed: { mobile: !opened } }} padding="md">
      <a href="#main-content" className={classes.skip}>
        Skip to main content
      </a>
      <Notifications position="top-right" limit={4} />
      <AppShell.Header className={classes.header}>
        {!single && <Burger opened={opened} onClick={toggle} hiddenFrom="sm" size="sm" aria-label="Show navigation" />}
        <Brand size="md" />
        <Box style={{ flex: 1 }} />
        {single && (
          <Group gap="xs" wrap="nowrap" aria-label="Account" role="group">
            <Text fz="sm" fw={500} truncate maw={220}>
              {user.name}
            </Text>
            <RoleBadge role={user.role} />
            {signOut}
          </Group>
        )}
        <ColorSchemeToggle />
      </AppShell.Header>

      {!single && (
        <AppShell.Navbar className={classes.navbar} p="xs" aria-label="Main navigation">
          <AppShell.Section grow component={ScrollArea}>
            <nav>
              {SCREEN_GROUPS.map((group) => {
                const entries = screens.filter((s) => s.group === group.key);
                if (entries.length === 0) return null;
                return (
                  <Box key={group.key} mb="xs" role="group" aria-label={group.label}>
                    <div className={classes.groupLabel}>{group.label}</div>
                    {entries.map((screen) => {
                      const Icon = ICONS[screen.key as ScreenKey];
                      const active = location.pathname === screen.path || location.pathname.startsWith(`${screen.path}/`);
                      return (
                        <NavLink
                          key={screen.key}
                          component={Link}
                          to={screen.path}
                          label={screen.label}
                          active={active}
                          aria-current={active ? 'page' : undefined}
                          className={classes.link}
                          leftSection={<Icon size={18} stroke={1.6} />}
                        />
                      );
                    })}
                  </Box>
                );
              })}
            </nav>
          </AppShell.Section>
          <AppShell.Section className={classes.user}>
            <Stack gap={6} px="xs" pb="xs">
              <Group gap={6} justify="space-between" wrap="nowrap">
                <Text fz="sm" fw={500} truncate>
                  {user.name}
                </Text>
                <RoleBadge role={user.role} />
              </Group>
              <Text fz="xs" c="dimmed" truncate>
                {user.email}
              </Text>
              {signOut}
            </Stack>
          </AppShell.Section>
        </AppShell.Navbar>
      )}

      <AppShell.Main className={classes.main} id="main-content" tabIndex={-1}>
        <Outlet />
      </AppShell.Main>
    </AppShell>
  );
}
