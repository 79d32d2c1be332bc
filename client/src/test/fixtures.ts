import type { Role, UserDto } from '@morrowline/shared';

let nextId = 100;

export function userFixture(role: Role, overrides: Partial<UserDto> = {}): UserDto {
  nextId += 1;
  return {
    id: nextId,
    email: `${role}${nextId}@tallowmere.example`,
    name: `Test ${role} ${nextId}`,
    role,
    active: true,
    createdAt: '2026-01-05T08:00:00.000Z',
    lastLoginAt: null,
    ...overrides,
  };
}
