// The zones' weather (observed temperature, temperature forecasts, the weather feed's state), read
// by the live view and the schedules.
export { useZoneWeather, useWeatherStatus } from './api/use-zone-weather';
export { alignedTemperatures, formatTemperature, latestObserved, zoneWeatherState, type ZoneWeatherState } from './model/zone-weather';
export { HOUR_GROUPS, loadTemperaturePoints, type HourGroup, type LoadTemperaturePoint } from './model/load-temperature';
