import { type INestApplication } from '@nestjs/common';
import { MetadataScanner, ModulesContainer, Reflector } from '@nestjs/core';
import { IS_PUBLIC_KEY } from '../../src/common/decorators/public.decorator';
import { ACCESS_KEY, type AccessRule } from '../../src/common/decorators/access.decorator';

export interface RouteInfo {
  method: string;
  /** Express path, e.g. /api/users/:id */
  path: string;
}

/** Every route the running Express app answers, read from its router (not from a hand list). */
export function expressRoutes(app: INestApplication): RouteInfo[] {
  const express = app.getHttpAdapter().getInstance() as {
    router: { stack: { route?: { path: string; methods: Record<string, boolean> } }[] };
  };
  const routes: RouteInfo[] = [];
  for (const layer of express.router.stack) {
    if (!layer.route) continue;
    for (const [method, on] of Object.entries(layer.route.methods)) {
      if (on && method !== '_all') routes.push({ method: method.toUpperCase(), path: layer.route.path });
    }
  }
  return routes;
}

export interface HandlerInfo {
  controller: string;
  handler: string;
  isPublic: boolean;
  access: AccessRule | undefined;
}

/** Every controller handler with its access metadata, found in the application's module container. */
export function controllerHandlers(app: INestApplication): HandlerInfo[] {
  const modules = app.get(ModulesContainer);
  const scanner = new MetadataScanner();
  const reflector = app.get(Reflector);
  const out: HandlerInfo[] = [];
  const wrappers = [...modules.values()].flatMap((m) => [...m.controllers.values()]);
  for (const wrapper of wrappers) {
    const instance = wrapper.instance as object | undefined;
    if (!instance || !wrapper.metatype) continue;
    const proto = Object.getPrototypeOf(instance) as object;
    for (const name of scanner.getAllMethodNames(proto)) {
      const handler = (proto as Record<string, unknown>)[name] as () => unknown;
      if (Reflect.getMetadata('method', handler) === undefined) continue; // not a route handler
      const targets = [handler, wrapper.metatype as object];
      out.push({
        controller: wrapper.name as string,
        handler: name,
        isPublic: reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, targets as never) ?? false,
        access: reflector.getAllAndOverride<AccessRule | undefined>(ACCESS_KEY, targets as never),
      });
    }
  }
  return out;
}
