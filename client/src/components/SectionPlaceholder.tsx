import { EmptyState, Paper } from '@mantine/core';
import type { ReactNode } from 'react';
import { PageHeader } from './PageHeader';

interface SectionPlaceholderProps {
  title: string;
  /** One line saying what will appear here once the section is built. */
  comingHere: string;
  children?: ReactNode;
}

/** A section of the desk that later work fills: says what it will hold, nothing more. */
export function SectionPlaceholder({ title, comingHere, children }: SectionPlaceholderProps) {
  return (
    <>
      <PageHeader title={title} />
      <Paper withBorder p="xl" radius="md">
        <EmptyState
          title="Not built yet"
          description={comingHere}
          icon={<HorizonGlyph />}
          withIndicatorBackground
        />
        {children}
      </Paper>
    </>
  );
}

function HorizonGlyph() {
  return (
    <svg width="28" height="28" viewBox="0 0 24 24" aria-hidden="true">
      <path d="M3 16h18" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" opacity="0.6" />
      <path d="M3 18c3 0 3.5-4 6-4s3 2 5.5 0 3-7 6.5-8" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
    </svg>
  );
}
