import type { Services } from '../api/services';
import { seedDemoPlatform } from './demo-platform';
import { seedDemoStage3 } from './demo-stage3';
import { seedDemoStage3Measurements } from './demo-stage3-stored-measurements';
import { seedDemoStage3Sweeps } from './demo-stage3-sweeps';
import { seedDemoStage3Verification } from './demo-stage3-verification';

/**
 * Loads the invented demo scenario (Kestrel Yard Post, Stage 3) into an empty database only.
 * Each part adds its own step here.
 */
export async function loadDemoData(services: Services): Promise<boolean> {
  if ((await services.db.models.User.count()) > 0) return false;
  await seedDemoPlatform(services);
  await seedDemoStage3(services);
  await seedDemoStage3Measurements(services);
  await seedDemoStage3Verification(services);
  await seedDemoStage3Sweeps(services);
  services.logger.info('loaded the demo data (Kestrel Yard Post, demo only)');
  return true;
}
