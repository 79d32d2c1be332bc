import { Entity, ManyToOne, PrimaryKeyProp, Property } from '@mikro-orm/core';
import { Zone } from '../../zones/entities/zone.entity';
import { WeatherStation } from './weather-station.entity';

/** One station's share of a zone's temperature (the zone's weights are normalised when used). */
@Entity({ tableName: 'zone_station_weights' })
export class ZoneStationWeight {
  [PrimaryKeyProp]?: ['zone', 'station'];

  @ManyToOne(() => Zone, { primary: true, deleteRule: 'cascade' })
  zone!: Zone;

  @ManyToOne(() => WeatherStation, { primary: true, deleteRule: 'restrict' })
  station!: WeatherStation;

  @Property({ type: 'double' })
  weight!: number;
}
