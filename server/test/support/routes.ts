import { RequestMethod, type Type } from '@nestjs/common';
import { METHOD_METADATA, PATH_METADATA, ROUTE_ARGS_METADATA } from '@nestjs/common/constants';
import { RouteParamtypes } from '@nestjs/common/enums/route-paramtypes.enum';
import { MetadataScanner, ModulesContainer } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { getMetadataStorage } from 'class-validator';
import type { Role } from '@morrowline/shared';
import { PUBLIC_KEY, ROLES_KEY } from '../../src/common/decorators/roles.decorator';

/** A DTO field: its name, its declared type where TypeScript recorded one, and whether null is allowed. */
export interface BodyField {
  name: string;
  /** 'string', 'number', 'boolean', 'array', or 'unknown' (a union type, or a mapped DTO). */
  type: 'string' | 'number' | 'boolean' | 'array' | 'unknown';
  /** Checked only when present and not null (IsOptionalOrNull, or class-validator's own IsOptional). */
  nullable: boolean;
}

function fieldsOf(dto: Type<unknown>): BodyField[] {
  const metadatas = getMetadataStorage().getTargetValidationMetadatas(dto, '', true, false);
  const names = [...new Set(metadatas.map((m) => m.propertyName))];
  return names.map((name) => {
    const own = metadatas.filter((m) => m.propertyName === name);
    const conditional = own.some((m) => m.type === 'conditionalValidation');
    const refusesNull = own.some((m) => m.name === 'isNotNull');
    const designType = Reflect.getMetadata('design:type', dto.prototype as object, name) as unknown;
    const type = designType === String ? 'string' : designType === Number ? 'number' : designType === Boolean ? 'boolean' : designType === Array ? 'array' : 'unknown';
    return { name, type, nullable: conditional && !refusesNull };
  });
}

/** One HTTP route as the controllers declare it, read from Nest's own metadata. */
export interface RouteInfo {
  /** GET, POST, … */
  method: string;
  /** Full path with the /api prefix and its :params, e.g. /api/users/:id. */
  path: string;
  controller: string;
  handler: string;
  /** Roles that may call it; empty for a public route. */
  roles: Role[];
  isPublic: boolean;
  /** The DTO class of its @Body(), if it has one. */
  bodyType: Type<unknown> | null;
  /** Fields of that DTO, as class-validator knows them. */
  bodyFields: BodyField[];
  /** Names of its path parameters, in order. */
  params: string[];
}

function joinPath(...parts: (string | undefined)[]): string {
  return `/${parts.filter((p) => p !== undefined && p !== '' && p !== '/').map((p) => p!.replace(/^\/|\/$/g, '')).join('/')}`;
}

/** Every route of the running application, so a route added later is covered without a test edit. */
export function listRoutes(app: NestExpressApplication, prefix = 'api'): RouteInfo[] {
  const routes: RouteInfo[] = [];
  const scanner = new MetadataScanner();
  for (const module of app.get(ModulesContainer).values()) {
    for (const wrapper of module.controllers.values()) {
      const type = wrapper.metatype as Type<unknown> | null;
      if (!type) continue;
      const controllerPaths = ([] as string[]).concat(Reflect.getMetadata(PATH_METADATA, type) ?? '');
      for (const name of scanner.getAllMethodNames(type.prototype)) {
        const handler = (type.prototype as Record<string, unknown>)[name] as object;
        const methodPaths = Reflect.getMetadata(PATH_METADATA, handler) as string | string[] | undefined;
        const method = Reflect.getMetadata(METHOD_METADATA, handler) as RequestMethod | undefined;
        if (methodPaths === undefined || method === undefined) continue;
        const roles = (Reflect.getMetadata(ROLES_KEY, handler) ?? Reflect.getMetadata(ROLES_KEY, type) ?? []) as Role[];
        const isPublic = Boolean(Reflect.getMetadata(PUBLIC_KEY, handler) ?? Reflect.getMetadata(PUBLIC_KEY, type));
        const args = (Reflect.getMetadata(ROUTE_ARGS_METADATA, type, name) ?? {}) as Record<string, { index: number }>;
        const paramTypes = (Reflect.getMetadata('design:paramtypes', type.prototype, name) ?? []) as Type<unknown>[];
        const bodyKey = Object.keys(args).find((key) => key.startsWith(`${RouteParamtypes.BODY}:`));
        const bodyType = bodyKey !== undefined ? (paramTypes[args[bodyKey].index] ?? null) : null;
        const bodyFields = bodyType ? fieldsOf(bodyType) : [];
        for (const controllerPath of controllerPaths) {
          for (const methodPath of ([] as string[]).concat(methodPaths)) {
            const path = joinPath(prefix, controllerPath, methodPath);
            routes.push({
              method: RequestMethod[method],
              path,
              controller: type.name,
              handler: name,
              roles,
              isPublic,
              bodyType,
              bodyFields,
              params: [...path.matchAll(/:(\w+)/g)].map((m) => m[1]),
            });
          }
        }
      }
    }
  }
  return routes;
}

/** Methods that change something. */
export const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
