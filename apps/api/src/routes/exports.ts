import { join } from 'node:path';
import { exportBody, exportListQuery, idParams, type Subject } from '@busbar/shared';
import { Router } from 'express';
import { locationScope, reportWithin, type LocationScope } from '../access/locations.ts';
import type { Viewer } from '../access/viewer.ts';
import type { AppContext } from '../context.ts';
import { conflict, forbidden, notFound } from '../errors.ts';
import { exportFile, type ExportSpec } from '../exports/export-job.ts';
import { exportScopeLabel } from '../exports/scope-label.ts';
import { EXPORTED_FIELDS } from '../exports/sheets.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { exportById, insertExport, listExports } from '../queries/exports.ts';
import { background } from '../threads/background.ts';

const EXPORTERS_ONLY = 'Only the accountant and the network owner export the month close';
const OUTSIDE = 'You cannot export the month close of that shop or region';

/** Everyone's exports for the owner (who reads the audit log too); one's own for everyone else. */
const seesAll = (viewer: Viewer) => viewer.ability.can('read', 'AuditLog');

/** The shops asked for, each one the person may export; or the person's shops within the region asked for. */
function exportScope(viewer: Viewer, body: { locationIds?: number[] | undefined; regionId?: number | undefined }): LocationScope {
  const readable = locationScope(viewer, 'export', 'Report');
  if (!body.locationIds) return reportWithin(viewer, readable, { regionId: body.regionId }, { none: EXPORTERS_ONLY, outside: OUTSIDE });
  if (readable !== 'all' && readable.length === 0) throw forbidden(EXPORTERS_ONLY);
  const asked = [...new Set(body.locationIds)].sort((a, b) => a - b);
  if (readable !== 'all' && asked.some((id) => !readable.includes(id))) throw forbidden(OUTSIDE);
  if (readable === 'all' && asked.some((id) => !viewer.locationIds.includes(id))) throw notFound('location');
  return asked;
}

/** Whether the person may still export every shop an earlier export covers (their roles may have changed since). */
function mayStillExport(viewer: Viewer, locationIds: number[] | null): boolean {
  const readable = locationScope(viewer, 'export', 'Report');
  return readable === 'all' || (locationIds !== null && locationIds.every((id) => readable.includes(id)));
}

/**
 * Exports of the month close: asked for here and made on the background thread (exports/), kept
 * in a history with their files to download again.
 */
export function exportsRouter({ db, config, now }: AppContext): Router {
  const router = Router();
  const folder = join(config.dataDir, 'exports');

  router.post(
    '/',
    validate({ body: exportBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      const scope = exportScope(viewer, body);
      const throughMonth = body.throughMonth ?? body.month;
      const sheet = body.format === 'csv' ? (body.sheet ?? 'summary') : null;
      const at = now().toISOString();
      const months = throughMonth === body.month ? body.month : `${body.month}-to-${throughMonth}`;
      const id = await insertExport(db, {
        kind: body.kind,
        month: body.month,
        throughMonth,
        locationIds: scope === 'all' ? null : JSON.stringify(scope),
        scopeLabel: await exportScopeLabel(db, scope, body.regionId),
        locationCount: scope === 'all' ? viewer.locationIds.length : scope.length,
        format: body.format,
        sheet,
        status: 'queued',
        rowsTotal: null,
        error: null,
        fileName: `busbar-month-close-${months}${sheet ? `-${sheet}` : ''}.${body.format}`,
        fileBytes: null,
        checksum: null,
        createdBy: viewer.id,
        createdAt: at,
        finishedAt: null,
      }).catch((error: { code?: string }) => {
        // One unfinished export per person, held by a unique index (migration 035).
        throw error.code === 'SQLITE_CONSTRAINT_UNIQUE' ? conflict('Your last export is still being made: wait for it to finish, then ask for the next') : error;
      });
      await writeAudit(db, { at, actorId: viewer.id, action: 'export.create', entity: 'export', entityId: id, before: null, after: { ...body, throughMonth, locations: scope } });
      const hidden = EXPORTED_FIELDS.filter((f) => {
        const [type, field] = f.split('.') as [Exclude<Subject, 'all'>, string];
        return !viewer.ability.can('read', type, field);
      });
      const spec: ExportSpec = { databaseFile: config.databaseFile, folder, id, month: body.month, throughMonth, scope, format: body.format, sheet, hidden, at };
      // The job keeps its own failures in the export's row; this catches a thread that stopped under it.
      void background.run('runExport', spec).catch(async (error: Error) => {
        await db.updateTable('exports').set({ status: 'failed', error: `The export stopped: ${error.message}`, finishedAt: now().toISOString() }).where('id', '=', id).where('status', 'in', ['queued', 'running']).execute();
      });
      res.status(202).json({ id });
    }),
  );

  router.get(
    '/',
    validate({ query: exportListQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      if (!seesAll(viewer) && !viewer.ability.can('export', 'Report')) throw forbidden(EXPORTERS_ONLY);
      res.json(await listExports(db, seesAll(viewer) ? null : viewer.id, query));
    }),
  );

  /** An export the person made, or any for the owner; 404 for everyone else. */
  const visibleExport = async (viewer: Viewer, id: number) => {
    const job = await exportById(db, id);
    if (!job || (job.createdById !== viewer.id && !seesAll(viewer))) throw notFound('export');
    return job;
  };

  router.get(
    '/:id',
    validate({ params: idParams }, async ({ params }, req, res) => {
      const { locationIds: _, ...job } = await visibleExport(viewerOf(req), params.id);
      res.json(job);
    }),
  );

  router.get(
    '/:id/file',
    validate({ params: idParams }, async ({ params }, req, res) => {
      const viewer = viewerOf(req);
      const job = await visibleExport(viewer, params.id);
      if (job.status === 'failed') throw conflict(`This export failed, so it has no file: ${job.error ?? 'no reason was kept'}`);
      if (job.status !== 'done') throw conflict('This export is still being made: download it once it is done');
      if (!mayStillExport(viewer, job.locationIds)) throw forbidden('You can no longer export some of the shops this export covers');
      res.download(exportFile(folder, job.id, job.format), job.fileName!);
    }),
  );

  return router;
}
