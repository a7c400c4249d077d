import type { Db } from '@busbar/db';
import type { Request, RequestHandler } from 'express';
import type { Viewer } from '../access/viewer.ts';
import { cachedViewer } from '../access/viewer-cache.ts';
import { HttpError } from '../errors.ts';

declare global {
  namespace Express {
    interface Request {
      viewer?: Viewer;
    }
  }
}

const unauthenticated = () => new HttpError(401, 'unauthenticated', 'Please sign in');

/** Loads the signed-in person (their ability cached, see viewer-cache.ts); a session of a person deactivated since is ended here. */
export function requireSession(db: Db): RequestHandler {
  return async (req, _res, next) => {
    const userId = req.session.userId;
    if (!userId) throw unauthenticated();
    const viewer = await cachedViewer(db, userId);
    if (!viewer) {
      await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
      throw unauthenticated();
    }
    req.viewer = viewer;
    next();
  };
}

/** The person requireSession loaded; routes behind it call this instead of trusting the request. */
export function viewerOf(req: Request): Viewer {
  if (!req.viewer) throw unauthenticated();
  return req.viewer;
}
