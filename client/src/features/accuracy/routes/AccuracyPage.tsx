import { SectionPlaceholder } from '../../../components/SectionPlaceholder';

export function AccuracyPage() {
  return (
    <SectionPlaceholder
      title="Accuracy"
      comingHere="MAPE, MAE, bias and peak-hour error by day, hour and zone, for the model forecast, for the published schedule and for the difference the adjustments made."
    />
  );
}
