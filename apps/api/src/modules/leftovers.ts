// Start-up sweep of what crashed uploads leave behind (photos and bench runs), before the server
// takes requests. See lib/leftovers.ts for the rules.
import type { EntityManager } from '@mikro-orm/sqlite';
import type { SweepResult } from '../lib/leftovers';
import { sweepPhotoLeftovers } from './photos/photos.service';
import { sweepRunLeftovers } from './runs/runs.service';

export async function sweepUploadLeftovers(em: EntityManager, uploadsDir: string): Promise<{ photos: SweepResult; runs: SweepResult }> {
  return { photos: await sweepPhotoLeftovers(em, uploadsDir), runs: await sweepRunLeftovers(em, uploadsDir) };
}
