import { SectionPlaceholder } from '../../../components/SectionPlaceholder';

export function HistoryPage() {
  return (
    <SectionPlaceholder
      title="History"
      comingHere="CSV uploads of past readings with a row-by-row report of what was rejected, and downloads of readings and forecasts."
    />
  );
}
