import { Router, type Request, type RequestHandler, type Response } from 'express';
import { z } from 'zod';
import type { Access } from '../../shared/access/capabilities';
import { authOf, type AuthContext } from '../middleware/require-auth';
import { markRoute } from '../middleware/request-log';
import { requireCapability } from '../middleware/require-capability';
import { paramsNotFound, parseWith, type Refusal } from '../middleware/validate';

/**
 * The API as a table: every area is a list of routes (method, path, who may call it, the
 * middleware chain). `server/routes/index.ts` mounts each area's router once at its prefix and
 * lists the table for the route × role tests, so what is mounted and what is tested are the same.
 */

export const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const;
export type Method = (typeof METHODS)[number];
/** Who may call a route: anyone, any signed-in member, or the roles with a capability. */
export type RouteAccess = Access | 'public';

export interface ApiRoute {
  method: Method;
  /** Path below the area's prefix, in Express syntax. */
  path: string;
  access: RouteAccess;
  handlers: RequestHandler[];
}

export interface ApiArea {
  /** Where the area's router is mounted below /api. */
  prefix: string;
  /** Public areas are mounted before the one sign-in check, every other area after it. */
  isPublic: boolean;
  /** Mounted before the JSON body parser (the payment webhook verifies the exact bytes). */
  rawBody: boolean;
  routes: ApiRoute[];
}

type Schema = z.ZodType | undefined;
type Parsed<S> = S extends z.ZodType ? z.output<S> : undefined;

/** What a route validates at the edge, and middleware that must run between the checks. */
export interface RouteSpec<P extends Schema, Q extends Schema, B extends Schema> {
  /** Path parameters; a value that does not parse is a record that does not exist (404). */
  params?: P;
  query?: Q;
  body?: B;
  /** How an invalid query or body is answered; by default a 422 naming the first bad field. */
  refuse?: Refusal;
  /** Middleware after params and query are checked and before the body is (paid-plan check, file upload). */
  before?: RequestHandler[];
}

/** What a handler receives: the parsed, typed request parts. */
export interface RouteInput<P extends Schema, Q extends Schema, B extends Schema> {
  params: Parsed<P>;
  query: Parsed<Q>;
  body: Parsed<B>;
  req: Request;
  /** The signed-in user and their organisation's scope (throws 401 on public routes). */
  readonly auth: AuthContext;
}

export type RouteHandler<P extends Schema, Q extends Schema, B extends Schema> = (input: RouteInput<P, Q, B>, res: Response) => unknown;

/** A record id in the path: 1–10 digits; anything else answers "<what> not found." (404). */
export const idOf = (what: string) => z.string().regex(/^\d{1,10}$/, { error: what }).transform(Number);

function chain<P extends Schema, Q extends Schema, B extends Schema>(
  access: RouteAccess, spec: RouteSpec<P, Q, B>, handle: RouteHandler<P, Q, B>,
): RequestHandler[] {
  const guard = access === 'public' || access === 'signedIn' ? [] : [requireCapability(access)];
  const checkPath: RequestHandler = (req, res, next) => {
    res.locals.params = spec.params ? parseWith(spec.params, req.params, paramsNotFound) : undefined;
    res.locals.query = spec.query ? parseWith(spec.query, req.query, spec.refuse) : undefined;
    next();
  };
  const run: RequestHandler = async (req, res) => {
    const body = spec.body ? parseWith(spec.body, req.body ?? {}, spec.refuse) : undefined;
    const input = {
      params: res.locals.params as Parsed<P>,
      query: res.locals.query as Parsed<Q>,
      body: body as Parsed<B>,
      req,
      get auth() {
        return authOf(req);
      },
    };
    await handle(input, res);
  };
  return [...guard, checkPath, ...(spec.before ?? []), run];
}

type Adder<A> = <P extends Schema = undefined, Q extends Schema = undefined, B extends Schema = undefined>(
  path: string, access: A, spec: RouteSpec<P, Q, B>, handle: RouteHandler<P, Q, B>,
) => void;
type PublicAdder = <P extends Schema = undefined, Q extends Schema = undefined, B extends Schema = undefined>(
  path: string, spec: RouteSpec<P, Q, B>, handle: RouteHandler<P, Q, B>,
) => void;

function collect<A extends RouteAccess>(routes: ApiRoute[]): Record<Method, Adder<A>> {
  const adder = (method: Method): Adder<A> => (path, access, spec, handle) => {
    routes.push({ method, path, access, handlers: chain(access, spec, handle) });
  };
  return { get: adder('get'), post: adder('post'), put: adder('put'), patch: adder('patch'), delete: adder('delete') };
}

/** An area for signed-in members: every route names the access it needs. */
export function memberArea(prefix: string, build: (route: Record<Method, Adder<Access>>) => void): ApiArea {
  const routes: ApiRoute[] = [];
  build(collect<Access>(routes));
  return { prefix, isPublic: false, rawBody: false, routes };
}

/** An area open to anyone (the credential, if any, is in the request itself: a token, a signature). */
export function publicArea(prefix: string, build: (route: Record<Method, PublicAdder>) => void, options: { rawBody?: boolean } = {}): ApiArea {
  const routes: ApiRoute[] = [];
  const add = collect<'public'>(routes);
  const open = (method: Method): PublicAdder => (path, spec, handle) => add[method](path, 'public', spec, handle);
  build({ get: open('get'), post: open('post'), put: open('put'), patch: open('patch'), delete: open('delete') });
  return { prefix, isPublic: true, rawBody: options.rawBody ?? false, routes };
}

/** The area's router: merged params, so nested prefixes (`/catchments/:catchmentId/runs`) reach the handlers. */
export function areaRouter(area: ApiArea): Router {
  const router = Router({ mergeParams: true });
  for (const route of area.routes) router[route.method](route.path, markRoute(`${route.method} ${fullPath(area, route)}`), ...route.handlers);
  return router;
}

/** The full path of a route below /api, as a client calls it (with its :params). */
export function fullPath(area: ApiArea, route: ApiRoute): string {
  return `/api${area.prefix}${route.path === '/' ? '' : route.path}`;
}
