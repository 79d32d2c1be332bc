export { ZonesPage } from './routes/ZonesPage';
// Other features (live load, schedules) read the zone list through this hook.
export { useZones } from './api/use-zones';
