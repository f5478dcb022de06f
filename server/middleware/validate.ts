import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { ValidationError } from '../lib/errors';
import { fieldsFromZod } from './error-handler';

type Part = 'body' | 'query' | 'params';

/**
 * Validates one part of the request with a shared zod schema and stores the parsed value in
 * res.locals.valid[part]; a failure is a 400 with one message per field.
 */
export function validate<S extends z.ZodType>(part: Part, schema: S): RequestHandler {
  return (req, res, next) => {
    const result = schema.safeParse(req[part] ?? {});
    if (!result.success) throw new ValidationError(fieldsFromZod(result.error));
    res.locals.valid = { ...(res.locals.valid ?? {}), [part]: result.data };
    next();
  };
}

/** Reads what validate() stored for a part, typed by its schema. */
export function valid<S extends z.ZodType>(
  res: { locals: Record<string, unknown> },
  part: Part,
  _schema: S,
): z.infer<S> {
  void _schema;
  return (res.locals.valid as Record<Part, z.infer<S>>)[part];
}
