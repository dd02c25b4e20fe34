import {
  BadRequestException,
  HttpException,
  PayloadTooLargeException,
  UnsupportedMediaTypeException,
} from '@nestjs/common';
import { type NestExpressApplication } from '@nestjs/platform-express';
import { type OpenAPIObject } from '@nestjs/swagger';
import express, { type NextFunction, type Request, type Response } from 'express';

/** Largest JSON request body, in bytes (CSV uploads have their own limit). */
export const MAX_JSON_BODY_BYTES = 100 * 1024;
/** Deepest nesting of arrays and objects in a JSON request body; the API's own bodies use four levels. */
export const MAX_JSON_DEPTH = 32;

const BODY_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
const JSON_TYPES = ['application/json', 'application/*+json'];

/**
 * Request bodies are checked before anything reads them as data, so that the validation pipe and
 * class-transformer only ever see small, shallow JSON:
 *
 * 1. a body on an API route must be JSON (415 otherwise), unless the route's OpenAPI operation
 *    declares another request type (the CSV uploads read their own body);
 * 2. JSON larger than MAX_JSON_BODY_BYTES is refused with 413, nested deeper than MAX_JSON_DEPTH
 *    with 400 (counted on the raw text, before it is parsed);
 * 3. parser errors become HTTP exceptions with a clear message, which Nest answers without logging
 *    them as server errors.
 *
 * Call before `app.init()` with the application created with `bodyParser: false`.
 */
export function useBodyLimits(app: NestExpressApplication, apiPrefix: string, document: OpenAPIObject): void {
  const ownTypeRoutes = routesWithOwnBodyType(document);
  const isApi = (req: Request) => req.path === apiPrefix || req.path.startsWith(`${apiPrefix}/`);

  app.use((req: Request, _res: Response, next: NextFunction) => {
    if (!isApi(req) || !BODY_METHODS.has(req.method) || !mayHaveBody(req)) return next();
    if (ownTypeRoutes.some((r) => r.method === req.method && r.path.test(req.path))) return next();
    if (req.is(JSON_TYPES)) return next();
    const type = req.headers['content-type'];
    const refuse = () =>
      next(
        new UnsupportedMediaTypeException([
          type
            ? `body must be JSON sent with Content-Type: application/json, not ${type.split(';')[0].trim()}`
            : 'body must be JSON sent with Content-Type: application/json',
        ]),
      );
    if (Number(req.headers['content-length']) > 0) return refuse();
    // Chunked, with no length: only the bytes tell whether a body came. None is no body (a
    // body-less POST such as the session refresh), whatever Content-Type the client put on it.
    receivesBytes(req).then(
      (some) => (some ? refuse() : next()),
      () => next(new BadRequestException(['the request body could not be read'])),
    );
  });
  app.use(
    express.json({
      limit: MAX_JSON_BODY_BYTES,
      type: JSON_TYPES,
      verify: (_req, _res, buf) => {
        if (jsonDepthExceeds(buf, MAX_JSON_DEPTH)) {
          throw Object.assign(new Error('too deep'), { type: 'entity.too.deep' });
        }
      },
    }),
  );
  app.use(bodyParserErrors);
}

/** Turns the JSON parser's errors into HTTP exceptions (Nest answers those without a stack trace in the log). */
const bodyParserErrors = (err: unknown, _req: Request, _res: Response, next: NextFunction): void => {
  const e = err as { type?: string; status?: number; expose?: boolean; message?: string } | undefined;
  if (!e || typeof e !== 'object' || err instanceof HttpException) return next(err);
  switch (e.type) {
    case 'entity.too.large':
      return next(
        new PayloadTooLargeException([`body must be at most ${MAX_JSON_BODY_BYTES} bytes of JSON`]),
      );
    case 'entity.too.deep':
      return next(
        new BadRequestException([`body must not nest arrays and objects more than ${MAX_JSON_DEPTH} deep`]),
      );
    case 'entity.parse.failed':
      return next(new BadRequestException(['body is not valid JSON']));
    case 'charset.unsupported':
    case 'encoding.unsupported':
      return next(new UnsupportedMediaTypeException([e.message ?? 'unsupported body encoding']));
    default:
      if (e.expose && typeof e.status === 'number' && e.status >= 400 && e.status < 500) {
        return next(new HttpException([e.message ?? 'bad request body'], e.status));
      }
      return next(err);
  }
};

/**
 * Whether the request may carry a body: a positive Content-Length, or Transfer-Encoding (length
 * unknown until it ends). No Content-Length, or Content-Length: 0, is no body.
 */
function mayHaveBody(req: Request): boolean {
  return req.headers['transfer-encoding'] !== undefined || Number(req.headers['content-length']) > 0;
}

/**
 * Reads a body of unknown length until its first byte (true) or its end (false). After a byte, the
 * rest is read and dropped, so the connection stays usable for the answer.
 */
function receivesBytes(req: Request): Promise<boolean> {
  return new Promise((resolve, reject) => {
    const stop = () => {
      req.off('data', onData);
      req.off('end', onEnd);
      req.off('error', onError);
    };
    const onData = (chunk: Buffer) => {
      if (chunk.length === 0) return;
      stop();
      req.resume();
      resolve(true);
    };
    const onEnd = () => {
      stop();
      resolve(false);
    };
    const onError = (err: Error) => {
      stop();
      reject(err);
    };
    req.on('data', onData);
    req.once('end', onEnd);
    req.once('error', onError);
  });
}

/** Operations whose OpenAPI request body is not JSON (e.g. text/csv uploads), as method and path pattern. */
function routesWithOwnBodyType(document: OpenAPIObject): { method: string; path: RegExp }[] {
  const out: { method: string; path: RegExp }[] = [];
  for (const [path, item] of Object.entries(document.paths)) {
    for (const [method, op] of Object.entries(item as Record<string, unknown>)) {
      const content = (op as { requestBody?: { content?: Record<string, unknown> } } | undefined)?.requestBody
        ?.content;
      if (!content || Object.keys(content).every((t) => t === 'application/json')) continue;
      const pattern = path
        .split(/\{[^}]+\}/)
        .map((part) => part.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'))
        .join('[^/]+');
      out.push({ method: method.toUpperCase(), path: new RegExp(`^${pattern}/?$`) });
    }
  }
  return out;
}

/**
 * Whether JSON text nests arrays and objects deeper than `max`, counted in one pass over the raw
 * bytes (brackets inside strings do not count). Needs no parsing, so a deep body costs no more than
 * its length.
 */
export function jsonDepthExceeds(buf: Uint8Array, max: number): boolean {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < buf.length; i++) {
    const c = buf[i];
    if (inString) {
      if (c === 0x5c)
        i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      if (++depth > max) return true;
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return false;
}
