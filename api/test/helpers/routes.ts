import { RequestMethod } from '@nestjs/common';
import { METHOD_METADATA, PATH_METADATA } from '@nestjs/common/constants';
import { ModulesContainer } from '@nestjs/core';
import type { INestApplication } from '@nestjs/common';
import { IS_PUBLIC_KEY } from '../../src/common/decorators/public.decorator';
import { ROLES_KEY } from '../../src/common/decorators/roles.decorator';

export interface RouteInfo {
  method: string;
  path: string;
  controller: string;
  handler: string;
  isPublic: boolean;
  roles: string[] | undefined;
}

/** Every HTTP route of every controller the app registered, with its access metadata. */
export function listRoutes(app: INestApplication): RouteInfo[] {
  const routes: RouteInfo[] = [];
  for (const module of app.get(ModulesContainer).values()) {
    for (const wrapper of module.controllers.values()) {
      const type = wrapper.metatype as (new (...args: unknown[]) => unknown) | undefined;
      if (!type) continue;
      const base = Reflect.getMetadata(PATH_METADATA, type) as string | undefined;
      const proto = type.prototype as Record<string, unknown>;
      for (const name of Object.getOwnPropertyNames(proto)) {
        const handler = proto[name];
        if (name === 'constructor' || typeof handler !== 'function') continue;
        const path = Reflect.getMetadata(PATH_METADATA, handler) as string | undefined;
        const method = Reflect.getMetadata(METHOD_METADATA, handler) as RequestMethod | undefined;
        if (path === undefined || method === undefined) continue;
        const meta = <T>(key: string) => (Reflect.getMetadata(key, handler) ?? Reflect.getMetadata(key, type)) as T | undefined;
        routes.push({
          method: RequestMethod[method],
          path: `/api/${[base, path].filter((p) => p && p !== '/').join('/')}`.replace(/\/+/g, '/'),
          controller: type.name,
          handler: name,
          isPublic: meta<boolean>(IS_PUBLIC_KEY) === true,
          roles: meta<string[]>(ROLES_KEY),
        });
      }
    }
  }
  return routes;
}
