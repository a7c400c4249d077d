import type { Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';

type Schemas = { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType };
type Out<S> = S extends z.ZodType ? z.output<S> : undefined;
export type Input<S extends Schemas> = { body: Out<S['body']>; query: Out<S['query']>; params: Out<S['params']> };

/**
 * Validates a request's body, query and params against zod schemas, then calls the handler with
 * the parsed values, so a handler only ever sees typed, checked input. Unknown fields fail in strict schemas.
 */
export function validate<S extends Schemas>(
  schemas: S,
  handler: (input: Input<S>, req: Request, res: Response) => Promise<void> | void,
): RequestHandler {
  // Express 5 passes a rejected promise (a ZodError or HttpError) on to the error middleware.
  return async (req: Request, res: Response) => {
    const input = {
      body: schemas.body ? schemas.body.parse(req.body ?? {}) : undefined,
      query: schemas.query ? schemas.query.parse(req.query) : undefined,
      params: schemas.params ? schemas.params.parse(req.params) : undefined,
    } as Input<S>;
    await handler(input, req, res);
  };
}
