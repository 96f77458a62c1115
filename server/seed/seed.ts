// The one place that seeds a fresh database. Later features add their demo objects (missions,
// orbits, cases…) as a function of their own in the list below, each given the demo team.
import { count } from 'drizzle-orm';
import type { AppContext } from '../app-context';
import { hashPassword } from '../auth/passwords';
import type { Tx } from '../db/database';
import { users } from '../db/schema';
import { withQuantityReader, type ReadQuantity } from '../missions/quantity-reader';
import { seedDemoTeam, type DemoTeam } from './demo';
import { seedDemoMissions } from './missions-demo';
import { seedDemoCases } from './cases-demo';
import { seedDemoThermalModel } from './thermal-demo';

/** A feature's demo objects; typed quantities are read with `read`, as the API reads them. */
export type FeatureSeed = (tx: Tx, team: DemoTeam, read: ReadQuantity) => void;

const featureSeeds: FeatureSeed[] = [seedDemoMissions, seedDemoCases, seedDemoThermalModel];

/** Seeds the demo data when ECLIPTA_SEED=demo and there are no users yet; answers whether it did. */
export async function seedDatabase(ctx: Pick<AppContext, 'db' | 'config' | 'logger'>): Promise<boolean> {
  if (ctx.config.seed !== 'demo') return false;
  const existing = ctx.db.select({ n: count() }).from(users).get();
  if ((existing?.n ?? 0) > 0) return false;
  const passwordHash = await hashPassword(ctx.config.demoPassword, ctx.config.bcryptCost);
  await withQuantityReader((read) => ctx.db.transaction((tx) => {
    const team = seedDemoTeam(tx, passwordHash);
    for (const seed of featureSeeds) seed(tx, team, read);
  }));
  ctx.logger.info('demo data seeded', { workspaces: ['Kestrel', 'Plover'] });
  return true;
}
