import { z } from 'zod';

/** A positive integer id taken from a path or query string. */
export const idSchema = z.coerce.number().int().positive();
export const idParams = z.strictObject({ id: idSchema });

/** For routes that take no query: any parameter is an unknown field. */
export const noQuery = z.strictObject({});

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address' }).max(254));

export const personNameSchema = z.string().trim().min(1, 'Enter a name').max(120);

/** Passwords: long rather than clever (NIST SP 800-63B asks for at least 8; we ask 12). */
export const newPasswordSchema = z
  .string()
  .min(12, 'Use at least 12 characters')
  .max(200, 'Use at most 200 characters');

export const pageQuery = {
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
};

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** The one error shape every failed request answers with. */
export interface ApiError {
  error: { code: string; message: string; fields?: Record<string, string> };
}
