import type { Role } from './roles';

/** One error shape for every failed API call. */
export interface ApiError {
  statusCode: number;
  error: string;
  message: string;
  /** Field-level problems from validation, when there are any. */
  details?: string[];
  path: string;
  timestamp: string;
}

export interface LoginRequest {
  email: string;
  password: string;
}

export interface UserDto {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  createdAt: string;
  lastLoginAt: string | null;
}

export interface LoginResponse {
  accessToken: string;
  tokenType: 'Bearer';
  /** Seconds until the access token expires. */
  expiresIn: number;
  user: UserDto;
}

export interface CreateUserRequest {
  email: string;
  name: string;
  role: Role;
  password: string;
}

export interface UpdateUserRequest {
  role?: Role;
  active?: boolean;
  name?: string;
  /** Why the change was made; written to the audit trail. */
  reason?: string;
}

export interface ZoneDto {
  id: number;
  code: string;
  name: string;
  /** IANA time zone, e.g. America/Denver. Operating days follow it. */
  timeZone: string;
  /** Deviation alert threshold in percent of forecast. */
  alertThresholdPct: number;
  /** How many consecutive hours beyond the threshold raise an alert. */
  alertConsecutiveHours: number;
  /** Local time on the day before the operating day by which the schedule is due, "HH:mm". */
  gateClosure: string;
  /** Lowest and highest plausible hourly load in MW; readings outside are rejected. */
  minPlausibleMw: number;
  maxPlausibleMw: number;
  active: boolean;
}

export type CreateZoneRequest = Omit<ZoneDto, 'id' | 'active'> & { active?: boolean };
export type UpdateZoneRequest = Partial<Omit<ZoneDto, 'id' | 'code'>> & { reason?: string };

export interface AuditEntryDto {
  id: number;
  at: string;
  actorId: number | null;
  actorEmail: string | null;
  action: string;
  subjectType: string;
  subjectId: string | null;
  before: unknown;
  after: unknown;
  reason: string | null;
}

export interface Page<T> {
  items: T[];
  total: number;
}

export interface HealthDto {
  status: 'ok' | 'degraded';
  database: 'up' | 'down';
  version: string;
  time: string;
}

/**
 * The message of the 503 every route answers while the server cannot reach its database. The
 * desk keeps its session and shows a banner while it sees this, instead of signing anyone out.
 */
export const DATABASE_UNAVAILABLE_MESSAGE = 'The server cannot reach its database; try again shortly';
