import { SectionPlaceholder } from '../../../components/SectionPlaceholder';

export function LiveLoadPage() {
  return (
    <SectionPlaceholder
      title="Live load"
      comingHere="Actual load against the current forecast, its 80 % and 95 % bands and the published schedule, per zone and for the system, with deviation alerts to acknowledge."
    />
  );
}
