import type { DataSource } from 'typeorm';

/** One node of a PostgreSQL plan, flattened. */
export interface PgPlanStep {
  type: string;
  index: string | undefined;
  relation: string | undefined;
  cond: string;
}

interface PgNode {
  'Node Type': string;
  'Index Name'?: string;
  'Relation Name'?: string;
  'Index Cond'?: string;
  Plans?: PgNode[];
}

/**
 * The plan PostgreSQL picks for `sql` when it cannot fall back to reading the whole table or
 * sorting (run ANALYZE after loading test rows): with a handful of test rows a sequential scan is always cheapest, so the test asks
 * instead whether an index can serve the filter and the order (a Sort node or a Seq Scan in the
 * plan means none can). Settings are local to a transaction that is rolled back.
 */
export async function explainPostgres(
  ds: DataSource,
  sql: string,
  params: unknown[],
): Promise<PgPlanStep[]> {
  const qr = ds.createQueryRunner();
  await qr.connect();
  try {
    await qr.startTransaction();
    for (const knob of ['enable_seqscan', 'enable_bitmapscan', 'enable_sort'])
      await qr.query(`SET LOCAL ${knob} = off`);
    const [row] = (await qr.query(`EXPLAIN (FORMAT JSON) ${sql}`, params)) as {
      'QUERY PLAN': { Plan: PgNode }[];
    }[];
    const steps: PgPlanStep[] = [];
    const walk = (n: PgNode) => {
      steps.push({
        type: n['Node Type'],
        index: n['Index Name'],
        relation: n['Relation Name'],
        cond: n['Index Cond'] ?? '',
      });
      n.Plans?.forEach(walk);
    };
    walk(row!['QUERY PLAN'][0]!.Plan);
    return steps;
  } finally {
    await qr.rollbackTransaction().catch(() => undefined);
    await qr.release();
  }
}

export const describeStep = (s: PgPlanStep) =>
  `${s.type}${s.index ? ` using ${s.index}` : ''}${s.relation ? ` on ${s.relation}` : ''}${s.cond ? ` (${s.cond})` : ''}`;
