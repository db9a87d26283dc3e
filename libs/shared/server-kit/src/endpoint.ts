import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { ValidationError, type FieldProblem } from './errors';

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';
type Schema = z.ZodType | undefined;
type Parsed<S extends Schema> = S extends z.ZodType ? z.output<S> : undefined;

/**
 * One API operation, declared once: its zod schemas validate the request, type the
 * handler and feed the OpenAPI document; `permission` is what the caller must hold.
 */
export interface EndpointDef<
  B extends Schema = Schema,
  Q extends Schema = Schema,
  P extends Schema = Schema,
> {
  method: HttpMethod;
  /** Express path below /api/v1, e.g. `/takeoffs/:id`. */
  path: string;
  summary: string;
  tags: string[];
  /** `public` for operations anyone may call; otherwise a permission such as `jobs:read`. */
  permission: string;
  body?: B;
  query?: Q;
  params?: P;
  response?: z.ZodType;
  /** Success status, 200 unless given. */
  status?: number;
  handle(input: {
    body: Parsed<B>;
    query: Parsed<Q>;
    params: Parsed<P>;
    req: Request;
    res: Response;
  }): unknown;
}

/** Helper that keeps the schemas' types flowing into `handle`. */
export function endpoint<
  B extends Schema = undefined,
  Q extends Schema = undefined,
  P extends Schema = undefined,
>(def: EndpointDef<B, Q, P>): EndpointDef {
  return def as unknown as EndpointDef;
}

export function problemsOf(error: z.ZodError, prefix: string): FieldProblem[] {
  return error.issues.map((issue) => ({
    path: [prefix, ...issue.path.map(String)].filter(Boolean).join('.'),
    message: issue.message,
  }));
}

function parsePart(schema: Schema, value: unknown, part: string): unknown {
  if (!schema) return undefined;
  const result = schema.safeParse(value ?? {});
  if (result.success) return result.data;
  const problems = problemsOf(result.error, part === 'body' ? '' : part);
  const first = problems[0];
  const where = first?.path ? ` (${first.path})` : '';
  throw new ValidationError(
    `Invalid ${part}${where}: ${first?.message ?? 'check the input'}`,
    problems,
  );
}

export interface RouterOptions {
  /** Throws (401/403) unless the request may use an operation guarded by `permission`. */
  guard?: (req: Request, permission: string) => void | Promise<void>;
}

/**
 * Builds an Express router from endpoint declarations, in declaration order. The guard
 * runs before validation, so a caller without access learns nothing from error details.
 */
export function routerFor(endpoints: readonly EndpointDef[], options: RouterOptions = {}): Router {
  const router = Router();
  for (const def of endpoints) {
    router[def.method](def.path, async (req, res) => {
      await options.guard?.(req, def.permission);
      const body = parsePart(def.body, req.body, 'body');
      const query = parsePart(def.query, req.query, 'query');
      const params = parsePart(def.params, req.params, 'params');
      const result = await def.handle({ body, query, params, req, res } as never);
      if (res.headersSent) return;
      // A handler may pick the status itself (health answers 503 when degraded).
      const status = res.statusCode !== 200 ? res.statusCode : (def.status ?? 200);
      res.status(status).json(result);
    });
  }
  return router;
}
