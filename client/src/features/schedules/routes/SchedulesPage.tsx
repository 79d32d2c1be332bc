import { Text } from '@mantine/core';
import { SectionPlaceholder } from '../../../components/SectionPlaceholder';

export function SchedulesPage() {
  return (
    <SectionPlaceholder
      title="Day-ahead schedule"
      comingHere="Tomorrow's hourly schedule per zone with the gate-closure countdown: the model forecast, adjustments and their reasons, approval and published revisions."
    >
      <Text size="xs" c="dimmed" ta="center" mt="lg">
        Forecasts support, and never replace, the judgement of the responsible system operator.
        Operating decisions follow the control area&apos;s reliability standards, market rules and
        local regulations.
      </Text>
    </SectionPlaceholder>
  );
}
