import { Entity, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import { WeatherStation } from '../../weather/entities/weather-station.entity';
import { Zone } from '../../zones/entities/zone.entity';

/**
 * A meter feed's API key. Only the SHA-256 of the key is stored (the key is 32 random bytes, so
 * a fast hash is enough); the key itself is shown once when it is created.
 */
@Entity({ tableName: 'feed_keys' })
export class FeedKey {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @Property({ type: 'string', length: 120, unique: true })
  name!: string;

  /** Hex SHA-256 of the key. */
  @Property({ type: 'string', length: 64, unique: true, hidden: true })
  keyHash!: string;

  /** The first characters of the key, to tell keys apart in lists. */
  @Property({ type: 'string', length: 16 })
  prefix!: string;

  /** When set, the key may only send readings for this zone. */
  @ManyToOne(() => Zone, { nullable: true, deleteRule: 'restrict' })
  zone: Zone | null = null;

  /** When set, the key may only send weather for this station (and no readings). */
  @ManyToOne(() => WeatherStation, { nullable: true, deleteRule: 'restrict' })
  station: WeatherStation | null = null;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();

  @Property({ type: 'integer', nullable: true })
  createdById: number | null = null;

  @Property({ type: 'string', length: 254, nullable: true })
  createdByEmail: string | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  lastUsedAt: Date | null = null;

  @Property({ type: 'datetime', length: 3, nullable: true })
  revokedAt: Date | null = null;
}
