import { subject } from '@casl/ability';
import { customerBody, customerHistoryQuery, customerQuery, customerUpdate, idParams, type CustomerPlanRow } from '@busbar/shared';
import { Router } from 'express';
import { readable } from '../access/fields.ts';
import { locationScope, locationToAddAt, narrowScope, type LocationScope } from '../access/locations.ts';
import { quickPlanSummaries } from '../access/plans.ts';
import type { Viewer } from '../access/viewer.ts';
import type { AppContext } from '../context.ts';
import { forbidden, notFound, stale } from '../errors.ts';
import { viewerOf } from '../middleware/session.ts';
import { validate } from '../middleware/validate.ts';
import { writeAudit } from '../queries/audit.ts';
import { customerBuilds, customerPlans } from '../queries/customer-history.ts';
import { findCustomer, insertCustomer, listCustomers, updateCustomer } from '../queries/customers.ts';
import { vehiclesOf } from '../queries/vehicles.ts';

/** Of the scope, where the person reads a customer's field. */
function readingField(viewer: Viewer, field: string, scope: LocationScope): LocationScope {
  if (scope === 'all') return locationScope(viewer, 'read', 'Customer', field);
  return scope.filter((locationId) => viewer.ability.can('read', subject('Customer', { locationId }), field));
}

/** Where the person reads both records of `types`. */
function readingAll(viewer: Viewer, types: ('Build' | 'Plan')[]): LocationScope {
  const scopes = types.map((type) => locationScope(viewer, 'read', type));
  return scopes.reduce((a, b) => (a === 'all' ? b : b === 'all' ? a : a.filter((id) => b.includes(id))));
}

/** Customers of the locations a person may see, without the contact details they may not read. */
export function customersRouter({ db, now }: AppContext): Router {
  const router = Router();

  /** The customer, or 404 where the person may not read them. */
  async function readableCustomer(viewer: Viewer, id: number) {
    const customer = await findCustomer(db, id);
    if (!customer || !viewer.ability.can('read', subject('Customer', { ...customer }))) throw notFound('customer');
    return customer;
  }

  router.get(
    '/',
    validate({ query: customerQuery }, async ({ query }, req, res) => {
      const viewer = viewerOf(req);
      const { ability } = viewer;
      if (!ability.can('read', 'Customer')) throw forbidden();
      const scope = narrowScope(viewer, locationScope(viewer, 'read', 'Customer'), query);
      const page = await listCustomers(db, {
        q: query.q,
        page: query.page,
        pageSize: query.pageSize,
        scope,
        emailScope: readingField(viewer, 'email', scope),
        phoneScope: readingField(viewer, 'phone', scope),
      });
      res.json({ ...page, items: page.items.map((c) => readable(ability, 'Customer', c)) });
    }),
  );

  router.get(
    '/:id',
    validate({ params: idParams }, async ({ params }, req, res) => {
      const viewer = viewerOf(req);
      const { ability } = viewer;
      const customer = await readableCustomer(viewer, params.id);
      const vehicles = (await vehiclesOf(db, customer.id))
        .filter((v) => ability.can('read', subject('Vehicle', { ...v })))
        .map((v) => readable(ability, 'Vehicle', v));
      res.json({ ...readable(ability, 'Customer', customer), vehicles });
    }),
  );

  router.get(
    '/:id/builds',
    validate({ params: idParams, query: customerHistoryQuery }, async ({ params, query }, req, res) => {
      const viewer = viewerOf(req);
      await readableCustomer(viewer, params.id);
      const page = await customerBuilds(db, params.id, readingAll(viewer, ['Build']), query);
      res.json({ ...page, items: page.items.map((b) => readable(viewer.ability, 'Build', b)) });
    }),
  );

  router.get(
    '/:id/plans',
    validate({ params: idParams, query: customerHistoryQuery }, async ({ params, query }, req, res) => {
      const viewer = viewerOf(req);
      await readableCustomer(viewer, params.id);
      const { rows, ...page } = await customerPlans(db, params.id, readingAll(viewer, ['Build', 'Plan']), query);
      const summaries = await quickPlanSummaries(db, rows);
      const items: CustomerPlanRow[] = summaries.map(({ id, name, version, updatedAt, verdict }, i) => ({
        id, buildId: rows[i]!.buildId!, buildNumber: rows[i]!.buildNumber, name, version, updatedAt, verdict,
      }));
      res.json({ ...page, items });
    }),
  );

  router.post(
    '/',
    validate({ body: customerBody }, async ({ body }, req, res) => {
      const viewer = viewerOf(req);
      await locationToAddAt(db, viewer, body.locationId, 'Customer', 'You cannot add customers at this location');
      const customer = await db.transaction().execute(async (trx) => {
        const at = now().toISOString();
        const after = (await findCustomer(trx, await insertCustomer(trx, body, at)))!;
        await writeAudit(trx, { at, actorId: viewer.id, action: 'customer.create', entity: 'customer', entityId: after.id, after });
        return after;
      });
      res.status(201).json(readable(viewer.ability, 'Customer', customer));
    }),
  );

  router.put(
    '/:id',
    validate({ params: idParams, body: customerUpdate }, async ({ params, body: { version, ...fields } }, req, res) => {
      const viewer = viewerOf(req);
      const customer = await db.transaction().execute(async (trx) => {
        const before = await findCustomer(trx, params.id);
        if (!before || !viewer.ability.can('read', subject('Customer', { ...before }))) throw notFound('customer');
        if (!viewer.ability.can('update', subject('Customer', { ...before }))) throw forbidden('You cannot change customers at this location');
        if (!(await updateCustomer(trx, before.id, version, fields))) throw stale();
        const after = (await findCustomer(trx, before.id))!;
        await writeAudit(trx, { at: now().toISOString(), actorId: viewer.id, action: 'customer.update', entity: 'customer', entityId: before.id, before, after });
        return after;
      });
      res.json(readable(viewer.ability, 'Customer', customer));
    }),
  );

  return router;
}
