import type { ReactNode } from 'react';
import { RequireRole, useSignedInUser } from '../../features/auth';
import { homePathFor, sectionById, type SectionId } from './sections';

/** Puts a screen behind the same role rule that decides whether the navigation shows it. */
export function SectionGate({ id, children }: { id: SectionId; children: ReactNode }) {
  const user = useSignedInUser();
  const section = sectionById(id);
  return (
    <RequireRole roles={section.roles} screen={section.label} homePath={homePathFor(user.role)}>
      {children}
    </RequireRole>
  );
}
