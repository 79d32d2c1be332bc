import { Group } from '@mantine/core';
import type { LoadView } from '../model/zone-view';
import { ZoneCard } from './ZoneCard';

interface ZoneStripProps {
  views: readonly LoadView[];
  hours: readonly string[];
  selected: string;
  thresholds: ReadonlyMap<string, number>;
  onSelect: (key: string) => void;
  /** Latest observed temperature per zone code. */
  temperatures?: ReadonlyMap<string, number | null>;
}

/** The system total and every zone side by side; choosing one puts it on the chart. */
export function ZoneStrip({ views, hours, selected, thresholds, onSelect, temperatures }: ZoneStripProps) {
  return (
    <Group gap="sm" align="stretch" wrap="wrap" role="group" aria-label="Zones">
      {views.map((view) => (
        <ZoneCard key={view.key} view={view} hours={hours} selected={view.key === selected} thresholdPct={thresholds.get(view.key) ?? null} onSelect={() => onSelect(view.key)} temperatureC={temperatures?.has(view.key) ? temperatures.get(view.key) : undefined} />
      ))}
    </Group>
  );
}
