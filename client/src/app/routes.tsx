import type { RouteObject } from 'react-router-dom';
import { AccuracyPage } from '../features/accuracy';
import { AuditPage } from '../features/audit';
import { FeedKeysPage } from '../features/feed-keys';
import { RequireSession, SignInPage } from '../features/auth';
import { ShiftLogPage } from '../features/handover';
import { HistoryPage } from '../features/history';
import { LiveLoadPage, WallDisplayPage } from '../features/live';
import { RefitsPage } from '../features/refits';
import { SchedulesPage } from '../features/schedules';
import { UsersPage } from '../features/users';
import { WorkbenchPage } from '../features/workbench';
import { ZonesPage } from '../features/zones';
import { AppLayout } from './layout/AppLayout';
import { HomeRedirect } from './navigation/HomeRedirect';
import { PageNotFound } from './navigation/PageNotFound';
import { RouteError } from './navigation/RouteError';
import { SectionGate } from './navigation/SectionGate';
import { homePathFor, SECTIONS, WALL_PATH, type SectionId } from './navigation/sections';

const SCREENS: Record<SectionId, () => React.JSX.Element> = {
  live: LiveLoadPage,
  workbench: WorkbenchPage,
  refits: RefitsPage,
  schedules: SchedulesPage,
  accuracy: AccuracyPage,
  'shift-log': ShiftLogPage,
  history: HistoryPage,
  users: UsersPage,
  zones: ZonesPage,
  'feed-keys': FeedKeysPage,
  audit: AuditPage,
};

/** The route tree, kept apart from the router instance so tests can mount it in memory. */
export const routes: RouteObject[] = [
  { path: '/sign-in', element: <SignInPage homePathFor={(user) => homePathFor(user.role)} /> },
  // The wall display: live load for every signed-in role, full screen without the desk's shell.
  {
    path: WALL_PATH,
    errorElement: <RouteError />,
    element: (
      <RequireSession>
        <WallDisplayPage />
      </RequireSession>
    ),
  },
  {
    path: '/',
    errorElement: <RouteError />,
    element: (
      <RequireSession>
        <AppLayout />
      </RequireSession>
    ),
    children: [
      { index: true, element: <HomeRedirect /> },
      ...SECTIONS.map((section) => {
        const Screen = SCREENS[section.id];
        return {
          path: section.path.slice(1),
          element: (
            <SectionGate id={section.id}>
              <Screen />
            </SectionGate>
          ),
        };
      }),
      { path: '*', element: <PageNotFound /> },
    ],
  },
];
