import { SectionPlaceholder } from '../../../components/SectionPlaceholder';

export function RefitsPage() {
  return (
    <SectionPlaceholder
      title="Refits"
      comingHere="Outage and bad-data windows, refits started by hand or on the timetable, and each candidate model set beside the one in service."
    />
  );
}
