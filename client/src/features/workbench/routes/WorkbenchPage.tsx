import { SectionPlaceholder } from '../../../components/SectionPlaceholder';

export function WorkbenchPage() {
  return (
    <SectionPlaceholder
      title="Model workbench"
      comingHere="For each zone: whether the series is stationary and why, ACF and PACF, the ARMA orders and coefficients in use, residual checks and a rolling backtest."
    />
  );
}
