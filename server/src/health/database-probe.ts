import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';

/** Whether the database answers a trivial query: what the health route reports. */
@Injectable()
export class DatabaseProbe {
  constructor(private readonly em: EntityManager) {}

  async isUp(): Promise<boolean> {
    try {
      await this.em.getConnection().execute('select 1');
      return true;
    } catch {
      return false;
    }
  }
}
