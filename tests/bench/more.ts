import type { Knex } from 'knex';
import type { Profile } from '@/db/lifecycle/profile';
import type { Row } from './run';

/** Benchmarks of the series, fleet, margin pass and chart (filled in as those land). */
export async function extraBenches(_ctx: { env: Record<string, string>; profile: Profile; root: Knex; fleet: { orgId: number; nodeIds: number[]; tokens: string[] } }): Promise<Row[]> {
  return [];
}
