import { NavLink, Stack, Text } from '@mantine/core';
import type { Role } from '@morrowline/shared';
import { NavLink as RouterNavLink, useLocation } from 'react-router-dom';
import { sectionsFor, WALL_PATH, type Section } from '../navigation/sections';

interface SectionNavigationProps {
  role: Role;
  onNavigate?: () => void;
}

export function SectionNavigation({ role, onNavigate }: SectionNavigationProps) {
  const sections = sectionsFor(role);
  const desk = sections.filter((section) => section.group === 'desk');
  const admin = sections.filter((section) => section.group === 'admin');
  return (
    <Stack gap="lg" component="nav" aria-label="Sections">
      {desk.length > 0 && <SectionGroup title="Desk" sections={desk} onNavigate={onNavigate} />}
      {admin.length > 0 && <SectionGroup title="Admin" sections={admin} onNavigate={onNavigate} />}
      <Stack gap={2}>
        <Text size="xs" fw={600} c="dimmed" tt="uppercase" px="sm" mb={4} lts={0.6}>
          Displays
        </Text>
        <NavLink component={RouterNavLink} to={WALL_PATH} label="Wall display" onClick={onNavigate} data-display="wall" />
      </Stack>
    </Stack>
  );
}

function SectionGroup({ title, sections, onNavigate }: { title: string; sections: Section[]; onNavigate?: () => void }) {
  const location = useLocation();
  return (
    <Stack gap={2}>
      <Text size="xs" fw={600} c="dimmed" tt="uppercase" px="sm" mb={4} lts={0.6}>
        {title}
      </Text>
      {sections.map((section) => (
        <NavLink
          key={section.id}
          component={RouterNavLink}
          to={section.path}
          label={section.label}
          active={location.pathname === section.path || location.pathname.startsWith(`${section.path}/`)}
          onClick={onNavigate}
          data-section={section.id}
        />
      ))}
    </Stack>
  );
}
