import { AppShell, Burger, Group } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { Outlet } from 'react-router-dom';
import { DatabaseOutageBanner } from '../../components/DatabaseOutageBanner';
import { Wordmark } from '../../components/Wordmark';
import { SignOutButton, useSignedInUser } from '../../features/auth';
import { PendingHandoverBanner } from '../../features/handover';
import { useLiveUpdates } from '../../features/live';
import { ColorSchemeToggle } from './ColorSchemeToggle';
import { SectionNavigation } from './SectionNavigation';
import { SignedInUser } from './SignedInUser';

export function AppLayout() {
  const user = useSignedInUser();
  const [navigationOpen, { toggle, close }] = useDisclosure(false);
  useLiveUpdates();

  return (
    <AppShell
      header={{ height: 56 }}
      navbar={{ width: 232, breakpoint: 'sm', collapsed: { mobile: !navigationOpen } }}
      padding="lg"
    >
      <AppShell.Header>
        <Group h="100%" px="md" justify="space-between" wrap="nowrap">
          <Group gap="sm" wrap="nowrap">
            <Burger opened={navigationOpen} onClick={toggle} hiddenFrom="sm" size="sm" aria-label="Show sections" />
            <Wordmark size={26} />
          </Group>
          <Group gap="md" wrap="nowrap">
            <SignedInUser user={user} />
            <ColorSchemeToggle />
            <SignOutButton />
          </Group>
        </Group>
      </AppShell.Header>
      <AppShell.Navbar p="sm">
        <SectionNavigation role={user.role} onNavigate={close} />
      </AppShell.Navbar>
      <AppShell.Main>
        <DatabaseOutageBanner />
        <PendingHandoverBanner />
        <Outlet />
      </AppShell.Main>
    </AppShell>
  );
}
