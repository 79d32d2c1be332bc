export { OutageWindowsPanel } from './components/OutageWindowsPanel';
// The live view shades the hours of these windows on its chart.
export { useOutages } from './api/use-outages';
export { outageHoursOf } from './outage-hours';
