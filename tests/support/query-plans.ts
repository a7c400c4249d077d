import type { Db } from '@busbar/db';
import { CompiledQuery, createQueryId, type KyselyPlugin, type RootOperationNode } from 'kysely';

/**
 * SQLite's plan of each statement `run` sends through `db`, line by line (EXPLAIN QUERY PLAN of
 * the statements as compiled, with their parameters).
 */
export async function plansOf(db: Db, run: (db: Db) => Promise<unknown>): Promise<string[][]> {
  const sent: RootOperationNode[] = [];
  const recorder: KyselyPlugin = {
    transformQuery: ({ node }) => {
      sent.push(node);
      return node;
    },
    transformResult: async ({ result }) => result,
  };
  await run(db.withPlugin(recorder));
  const plans: string[][] = [];
  for (const node of sent) {
    const compiled = db.getExecutor().compileQuery(node, createQueryId());
    const plan = await db.executeQuery<{ detail: string }>(CompiledQuery.raw(`explain query plan ${compiled.sql}`, [...compiled.parameters]));
    plans.push(plan.rows.map((r) => r.detail));
  }
  return plans;
}
