import type { Request, Response, Router } from 'express';
import type { ZodType } from 'zod';
import type { Role } from '../../shared/schemas/roles.js';
import type { User } from '../entities/User.js';
import { requireAccess } from './access.js';
import { parseOrThrow } from './validation.js';

/** Who may call a route: anyone, anyone signed in, or the listed roles. */
export type Access = 'public' | 'signed-in' | readonly Role[];

/** The guard has already turned away anyone not signed in, so only a public route's handler may lack a user. */
export type UserFor<A extends Access> = A extends 'public' ? User | undefined : User;

export interface RouteContext<B, Q, P, U extends User | undefined = User | undefined> {
  body: B;
  query: Q;
  params: P;
  user: U;
  req: Request;
  res: Response;
}

export interface RouteSpec<B = unknown, Q = unknown, P = unknown, A extends Access = Access> {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  path: string;
  access: A;
  body?: ZodType<B>;
  query?: ZodType<Q>;
  params?: ZodType<P>;
  /** Extra middleware before validation (e.g. a rate limiter or an upload parser). */
  before?: ((req: Request, res: Response, next: (err?: unknown) => void) => void)[];
  handler: (ctx: RouteContext<B, Q, P, UserFor<A>>) => Promise<void> | void;
}

/** Keeps the generic types of one route while collecting it in a plain array. */
export function defineRoute<B = undefined, Q = undefined, P = undefined, const A extends Access = Access>(spec: RouteSpec<B, Q, P, A>): RouteSpec {
  return spec as unknown as RouteSpec;
}

export interface RouteTableRow {
  method: string;
  path: string;
  access: Access;
  /** The route's own schemas, so tests can tell a valid input from a malformed one. */
  body?: ZodType;
  query?: ZodType;
  /** Takes a multipart upload rather than JSON. */
  upload: boolean;
}

/** Mounts specs on a router under `base` and returns the rows of the route table (used by the access tests). */
export function mountRoutes(router: Router, base: string, specs: RouteSpec[]): RouteTableRow[] {
  for (const spec of specs) {
    const fullPath = `${base}${spec.path}`;
    router[spec.method](fullPath, requireAccess(spec.access), ...(spec.before ?? []), async (req: Request, res: Response) => {
      const ctx: RouteContext<unknown, unknown, unknown> = {
        body: spec.body ? parseOrThrow(spec.body, req.body ?? {}, 'body') : undefined,
        query: spec.query ? parseOrThrow(spec.query, req.query ?? {}, 'query') : undefined,
        params: spec.params ? parseOrThrow(spec.params, req.params ?? {}, 'path') : undefined,
        user: req.user as User | undefined,
        req,
        res,
      };
      await spec.handler(ctx);
    });
  }
  return specs.map((s) => ({
    method: s.method.toUpperCase(), path: `${base}${s.path}`, access: s.access, body: s.body, query: s.query,
    upload: (s.before ?? []).some((mw) => mw.name === 'csvUpload'),
  }));
}
