import { RequestMethod, type INestApplication } from '@nestjs/common';
import { METHOD_METADATA, PARAMTYPES_METADATA, PATH_METADATA, ROUTE_ARGS_METADATA } from '@nestjs/common/constants';
import { RouteParamtypes } from '@nestjs/common/enums/route-paramtypes.enum';
import { ModulesContainer } from '@nestjs/core';
import type { ZodType } from 'zod';
import { listRoutes, type RouteInfo } from './routes';

export interface WriteRoute extends RouteInfo {
  /** The zod schema of the @Body() parameter (nestjs-zod DTOs keep it as a static `schema`); null when the body is not a zod DTO. */
  bodySchema: ZodType | null;
  /** False when the handler takes no body at all (nothing to send it). */
  takesBody: boolean;
}

/** Every POST/PUT/PATCH route the app registered, with the schema its body is validated with. */
export function listWriteRoutes(app: INestApplication): WriteRoute[] {
  const bodies = new Map<string, { schema: ZodType | null; takesBody: boolean }>();
  for (const module of app.get(ModulesContainer).values()) {
    for (const wrapper of module.controllers.values()) {
      const type = wrapper.metatype as (new (...args: unknown[]) => unknown) | undefined;
      if (!type) continue;
      const proto = type.prototype as Record<string, unknown>;
      for (const name of Object.getOwnPropertyNames(proto)) {
        const handler = proto[name];
        if (name === 'constructor' || typeof handler !== 'function') continue;
        if (Reflect.getMetadata(PATH_METADATA, handler) === undefined || Reflect.getMetadata(METHOD_METADATA, handler) === undefined) continue;
        const args = (Reflect.getMetadata(ROUTE_ARGS_METADATA, type, name) ?? {}) as Record<string, { index: number }>;
        const types = (Reflect.getMetadata(PARAMTYPES_METADATA, proto, name) ?? []) as unknown[];
        const bodyArg = Object.entries(args).find(([key]) => Number(key.split(':')[0]) === RouteParamtypes.BODY)?.[1];
        const dto = bodyArg ? (types[bodyArg.index] as { schema?: ZodType } | undefined) : undefined;
        bodies.set(`${type.name}.${name}`, { schema: dto?.schema ?? null, takesBody: bodyArg !== undefined });
      }
    }
  }
  return listRoutes(app)
    .filter(
      (r) => r.method === RequestMethod[RequestMethod.POST] || r.method === RequestMethod[RequestMethod.PUT] || r.method === RequestMethod[RequestMethod.PATCH],
    )
    .map((r) => {
      const body = bodies.get(`${r.controller}.${r.handler}`) ?? { schema: null, takesBody: false };
      return { ...r, bodySchema: body.schema, takesBody: body.takesBody };
    });
}
