import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { Role } from '@morrowline/shared';
import { User } from './entities/user.entity';

export interface NewUser {
  email: string;
  name: string;
  role: Role;
  passwordHash: string;
}

/** The users table: what sign-in, the token check and the user administration read and write. */
@Injectable()
export class UsersRepository {
  constructor(private readonly em: EntityManager) {}

  /** A fresh unit of work, for a service that runs a transaction over users. */
  fork(): EntityManager {
    return this.em.fork();
  }

  /** The account an e-mail signs in to, with its password hash (never loaded otherwise). */
  forLogin(email: string): Promise<User | null> {
    return this.em.fork().findOne(User, { email: email.trim().toLowerCase() }, { populate: ['passwordHash'] });
  }

  activeById(id: number): Promise<User | null> {
    return this.em.fork().findOne(User, { id, active: true });
  }

  byId(em: EntityManager, id: number): Promise<User | null> {
    return em.findOne(User, { id });
  }

  list(): Promise<User[]> {
    return this.em.fork().find(User, {}, { orderBy: { role: 'asc', name: 'asc' } });
  }

  /** A new, active user, written in the caller's transaction (its id is set on return). */
  async insert(tx: EntityManager, fields: NewUser): Promise<User> {
    const user = tx.create(User, { ...fields, active: true, createdAt: new Date(), lastLoginAt: null, sessionVersion: 0 });
    await tx.flush();
    return user;
  }

  async touchLastLogin(id: number): Promise<User> {
    const em = this.em.fork();
    const user = await em.findOneOrFail(User, { id });
    user.lastLoginAt = new Date();
    await em.flush();
    return user;
  }

  /** Ends every session of the user: tokens carrying an older version are refused from now on. */
  async raiseSessionVersion(id: number): Promise<void> {
    await this.em.fork().getConnection().execute('update `users` set `session_version` = `session_version` + 1 where `id` = ?', [id]);
  }
}
