/** Every entity the ORM knows, in one list (explicit, so tsc builds and tests discover the same). */
import { DeviationAlert } from '../alerts/entities/deviation-alert.entity';
import { AuditEntry } from '../audit/entities/audit-entry.entity';
import { FeedKey } from '../feeds/entities/feed-key.entity';
import { HandoverItem } from '../handover/entities/handover-item.entity';
import { HandoverNote } from '../handover/entities/handover-note.entity';
import { ReadingRevision } from '../readings/entities/reading-revision.entity';
import { Reading } from '../readings/entities/reading.entity';
import { ForecastRun } from '../forecasts/entities/forecast-run.entity';
import { ModelVersion } from '../models/entities/model-version.entity';
import { RefitJob } from '../models/entities/refit-job.entity';
import { Outage } from '../outages/entities/outage.entity';
import { ScheduleAdjustment } from '../schedules/entities/schedule-adjustment.entity';
import { ScheduleRevision } from '../schedules/entities/schedule-revision.entity';
import { ScheduleSubscriber } from '../schedules/entities/schedule-subscriber.entity';
import { User } from '../users/entities/user.entity';
import { Zone } from '../zones/entities/zone.entity';
import { SpecialDay } from '../calendar/entities/special-day.entity';
import { TemperatureForecast } from '../weather/entities/temperature-forecast.entity';
import { TemperatureObservation } from '../weather/entities/temperature-observation.entity';
import { WeatherStation } from '../weather/entities/weather-station.entity';
import { ZoneStationWeight } from '../weather/entities/zone-station-weight.entity';

export const ENTITIES = [User, AuditEntry, Zone, Reading, ReadingRevision, FeedKey, DeviationAlert, HandoverNote, HandoverItem, Outage, ModelVersion, RefitJob, ForecastRun, ScheduleRevision, ScheduleAdjustment, ScheduleSubscriber, WeatherStation, ZoneStationWeight, TemperatureObservation, TemperatureForecast, SpecialDay];
