import { UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import type { CreateUserRequest, UpdateUserRequest, UserDto } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import { DOMAIN_EVENTS, type SessionEnded } from '../events/domain-events';
import { DomainEventsPublisher } from '../events/domain-events.publisher';
import { User } from './entities/user.entity';
import { hashPassword } from './password';
import { UsersRepository } from './users.repository';

export function toUserDto(user: User): UserDto {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    active: user.active,
    createdAt: user.createdAt.toISOString(),
    lastLoginAt: user.lastLoginAt ? user.lastLoginAt.toISOString() : null,
  };
}

function snapshot(user: User) {
  return { email: user.email, name: user.name, role: user.role, active: user.active };
}

@Injectable()
export class UsersService {
  constructor(
    private readonly repository: UsersRepository,
    private readonly audit: AuditService,
    private readonly events: DomainEventsPublisher,
  ) {}

  findForLogin(email: string): Promise<User | null> {
    return this.repository.forLogin(email);
  }

  findActiveById(id: number): Promise<User | null> {
    return this.repository.activeById(id);
  }

  async getById(id: number): Promise<User> {
    const user = await this.repository.byId(this.repository.fork(), id);
    if (!user) throw new NotFoundException(`No user with id ${id}`);
    return user;
  }

  touchLastLogin(id: number): Promise<User> {
    return this.repository.touchLastLogin(id);
  }

  /** Sign-out: every token the user holds stops working, and open desk sockets are closed. */
  async endSessions(id: number): Promise<void> {
    await this.repository.raiseSessionVersion(id);
    this.events.publish(DOMAIN_EVENTS.sessionEnded, { userId: id, reason: 'signed-out' });
  }

  async list(): Promise<UserDto[]> {
    const users = await this.repository.list();
    return users.map(toUserDto);
  }

  async create(actor: Actor, request: CreateUserRequest): Promise<UserDto> {
    const email = request.email.trim().toLowerCase();
    const passwordHash = await hashPassword(request.password);
    try {
      const user = await this.repository.fork().transactional(async (tx) => {
        const created = await this.repository.insert(tx, { email, name: request.name.trim(), role: request.role, passwordHash });
        this.audit.stage(tx, actor, { action: 'user.create', subjectType: 'user', subjectId: created.id, after: snapshot(created) });
        return created;
      });
      return toUserDto(user);
    } catch (error) {
      if (error instanceof UniqueConstraintViolationException) {
        throw new ConflictException(`A user with e-mail ${email} already exists`);
      }
      throw error;
    }
  }

  async update(actor: Actor, id: number, request: UpdateUserRequest): Promise<UserDto> {
    if (id === actor.id && (request.active === false || (request.role && request.role !== 'admin'))) {
      throw new BadRequestException('You cannot deactivate yourself or take away your own admin role');
    }
    const { dto, ended } = await this.repository.fork().transactional(async (tx) => {
      const user = await this.repository.byId(tx, id);
      if (!user) throw new NotFoundException(`No user with id ${id}`);
      const before = snapshot(user);
      if (request.name !== undefined) user.name = request.name.trim();
      if (request.role !== undefined) user.role = request.role;
      if (request.active !== undefined) user.active = request.active;
      const after = snapshot(user);
      const action =
        before.role !== after.role ? 'user.role-change' : before.active !== after.active ? (after.active ? 'user.reactivate' : 'user.deactivate') : 'user.update';
      this.audit.stage(tx, actor, { action, subjectType: 'user', subjectId: id, before, after, reason: request.reason ?? null });
      // A desk's live socket was let in for the role and the account it had then.
      const ended: SessionEnded['reason'] | null = before.active && !after.active ? 'deactivated' : before.role !== after.role ? 'role-changed' : null;
      return { dto: toUserDto(user), ended };
    });
    if (ended) this.events.publish(DOMAIN_EVENTS.sessionEnded, { userId: id, reason: ended });
    return dto;
  }
}
