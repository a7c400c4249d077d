import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';

/** An error with the HTTP status and code the client gets; its message is shown to the person. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export const notFound = (what = 'record') => new HttpError(404, 'not_found', `No such ${what}`);
export const forbidden = (message = 'You do not have permission to do that') => new HttpError(403, 'forbidden', message);
export const conflict = (message: string, fields?: Record<string, string>) =>
  new HttpError(409, 'conflict', message, fields);

/** A 400 naming the one field at fault, with the same message overall and on the field. */
export const invalidField = (field: string, message: string) => new HttpError(400, 'invalid', message, { [field]: message });

/** An edit made against an old version of a record (optimistic locking). */
export const stale = () =>
  new HttpError(409, 'stale', 'Someone changed this since you opened it. Reload to see their changes.');

/** Zod issues as `{ field: message }`, naming nested fields with dots. */
export function fieldErrors(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.join('.') : '_';
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys) fields[[...issue.path, k].join('.')] ??= 'Unknown field';
    } else fields[key] ??= issue.message;
  }
  return fields;
}

/** The one place errors become responses; unexpected errors are logged and their text hidden. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof ZodError) {
    res.status(400).json({ error: { code: 'invalid', message: 'Some fields need attention', fields: fieldErrors(err) } });
    return;
  }
  if (err instanceof HttpError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, fields: err.fields } });
    return;
  }
  if (err?.code === 'SQLITE_CONSTRAINT_UNIQUE') {
    // Two requests raced for one unique value; the loser hears what a later request would.
    res.status(409).json({ error: { code: 'conflict', message: 'This was just recorded by someone else. Reload and try again.' } });
    return;
  }
  const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
  if (status === 500) console.error(err);
  const message = status === 413 ? 'The request is too large' : status === 500 ? 'Something went wrong on our side' : 'The request could not be read';
  res.status(status).json({ error: { code: status === 500 ? 'internal' : 'bad_request', message } });
};
