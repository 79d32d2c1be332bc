import { Entity, ManyToOne, PrimaryKey, Property } from '@mikro-orm/core';
import { User } from '../../users/entities/user.entity';

/** Who gets the publication e-mails; kept by supervisors. Removing one deactivates it. */
@Entity({ tableName: 'schedule_subscribers' })
export class ScheduleSubscriber {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @Property({ type: 'string', length: 254, unique: true })
  email!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  /** Zone codes, or null for every zone. */
  @Property({ type: 'json', nullable: true })
  zones: string[] | null = null;

  @Property({ type: 'boolean' })
  active: boolean = true;

  @ManyToOne(() => User, { nullable: true })
  addedBy: User | null = null;

  @Property({ type: 'datetime', length: 3 })
  addedAt: Date = new Date();
}
