import { SectionPlaceholder } from '../../../components/SectionPlaceholder';

export function ShiftLogPage() {
  return (
    <SectionPlaceholder
      title="Shift log"
      comingHere="Handover notes for the next shift, with the shift's alerts, refits, publications and exclusions gathered in, and who has acknowledged them."
    />
  );
}
