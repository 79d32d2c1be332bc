import { Entity, Index, PrimaryKey, Property } from '@mikro-orm/core';

/**
 * One line of the append-only audit trail. The actor's e-mail is copied in so that the line
 * stays readable whatever later happens to the account; the database refuses UPDATE and DELETE
 * on this table (see the migration's triggers).
 */
@Entity({ tableName: 'audit_entries' })
@Index({ properties: ['subjectType', 'subjectId'] })
export class AuditEntry {
  @PrimaryKey({ type: 'bigint', autoincrement: true })
  id!: string;

  @Index()
  @Property({ type: 'datetime', length: 3 })
  at: Date = new Date();

  @Property({ type: 'integer', nullable: true })
  actorId: number | null = null;

  @Property({ type: 'string', length: 254, nullable: true })
  actorEmail: string | null = null;

  @Index()
  @Property({ type: 'string', length: 64 })
  action!: string;

  @Property({ type: 'string', length: 64 })
  subjectType!: string;

  @Property({ type: 'string', length: 64, nullable: true })
  subjectId: string | null = null;

  @Property({ type: 'json', nullable: true })
  before: unknown = null;

  @Property({ type: 'json', nullable: true })
  after: unknown = null;

  @Property({ type: 'text', nullable: true })
  reason: string | null = null;
}
