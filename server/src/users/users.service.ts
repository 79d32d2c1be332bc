import { EntityManager, UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import type { CreateUserRequest, UpdateUserRequest, UserDto } from '@morrowline/shared';
import { AuditService, type Actor } from '../audit/audit.service';
import { User } from './entities/user.entity';
import { hashPassword } from './password';

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
    private readonly em: EntityManager,
    private readonly audit: AuditService,
  ) {}

  findForLogin(email: string): Promise<User | null> {
    return this.em.fork().findOne(User, { email: email.trim().toLowerCase() }, { populate: ['passwordHash'] });
  }

  findActiveById(id: number): Promise<User | null> {
    return this.em.fork().findOne(User, { id, active: true });
  }

  async getById(id: number): Promise<User> {
    const user = await this.em.fork().findOne(User, { id });
    if (!user) throw new NotFoundException(`No user with id ${id}`);
    return user;
  }

  async touchLastLogin(id: number): Promise<User> {
    const em = this.em.fork();
    const user = await em.findOneOrFail(User, { id });
    user.lastLoginAt = new Date();
    await em.flush();
    return user;
  }

  async list(): Promise<UserDto[]> {
    const users = await this.em.fork().find(User, {}, { orderBy: { role: 'asc', name: 'asc' } });
    return users.map(toUserDto);
  }

  async create(actor: Actor, request: CreateUserRequest): Promise<UserDto> {
    const em = this.em.fork();
    const user = em.create(User, {
      email: request.email.trim().toLowerCase(),
      name: request.name.trim(),
      role: request.role,
      passwordHash: await hashPassword(request.password),
      active: true,
      createdAt: new Date(),
      lastLoginAt: null,
    });
    try {
      await em.transactional(async (tx) => {
        tx.persist(user);
        await tx.flush();
        this.audit.stage(tx, actor, { action: 'user.create', subjectType: 'user', subjectId: user.id, after: snapshot(user) });
      });
    } catch (error) {
      if (error instanceof UniqueConstraintViolationException) {
        throw new ConflictException(`A user with e-mail ${user.email} already exists`);
      }
      throw error;
    }
    return toUserDto(user);
  }

  async update(actor: Actor, id: number, request: UpdateUserRequest): Promise<UserDto> {
    if (id === actor.id && (request.active === false || (request.role && request.role !== 'admin'))) {
      throw new BadRequestException('You cannot deactivate yourself or take away your own admin role');
    }
    return this.em.fork().transactional(async (tx) => {
      const user = await tx.findOne(User, { id });
      if (!user) throw new NotFoundException(`No user with id ${id}`);
      const before = snapshot(user);
      if (request.name !== undefined) user.name = request.name.trim();
      if (request.role !== undefined) user.role = request.role;
      if (request.active !== undefined) user.active = request.active;
      const after = snapshot(user);
      const action =
        before.role !== after.role ? 'user.role-change' : before.active !== after.active ? (after.active ? 'user.reactivate' : 'user.deactivate') : 'user.update';
      this.audit.stage(tx, actor, { action, subjectType: 'user', subjectId: id, before, after, reason: request.reason ?? null });
      return toUserDto(user);
    });
  }
}
