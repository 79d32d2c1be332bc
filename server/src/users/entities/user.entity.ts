import { Entity, Enum, type Opt, PrimaryKey, Property } from '@mikro-orm/core';
import { ROLES, type Role } from '@morrowline/shared';

@Entity({ tableName: 'users' })
export class User {
  @PrimaryKey({ type: 'integer', autoincrement: true })
  id!: number;

  @Property({ type: 'string', length: 254, unique: true })
  email!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  @Enum({ items: [...ROLES], type: 'string', length: 16 })
  role!: Role;

  /** argon2id hash; never leaves the server. */
  @Property({ type: 'string', length: 255, hidden: true, lazy: true })
  passwordHash!: string;

  @Property({ type: 'boolean', default: true })
  active: boolean = true;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date = new Date();

  @Property({ type: 'datetime', length: 3, nullable: true })
  lastLoginAt: Date | null = null;

  /** Raised by every sign-out: a token carrying an older version is no longer accepted. */
  @Property({ type: 'integer', unsigned: true, default: 0 })
  sessionVersion: Opt<number> = 0;
}
