import type { Request } from 'express';

export type Encoding = 'br' | 'gzip';

/** The best encoding the client accepts: brotli, then gzip, or none (a `q=0` refuses one). */
export function acceptedEncoding(req: Request): Encoding | null {
  const accepted = new Map<string, number>();
  for (const part of (req.headers['accept-encoding'] ?? '').split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    const q = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
    if (name) accepted.set(name, q ? Number(q.slice(2)) : 1);
  }
  const wants = (name: string) => (accepted.get(name) ?? accepted.get('*') ?? 0) > 0;
  return wants('br') ? 'br' : wants('gzip') ? 'gzip' : null;
}
