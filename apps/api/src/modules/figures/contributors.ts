import type { EntityManager } from '@mikro-orm/sqlite';
import type { TeardownFigureInput } from '@splitcase/calc';
import type { Teardown } from '../teardowns/teardown.entity';
import { readingFigureInputs } from '../measurements/figures';
import { benchRunFigureInputs } from '../runs/figures';

/**
 * Adds to the inputs of teardowns' figures from another module's records (e.g. a bench run's
 * measured capacity): one call for many teardowns, answered by teardown id (absent: nothing to add).
 */
export type FigureInputContributor = (em: EntityManager, teardowns: Teardown[]) => Promise<Map<number, Partial<TeardownFigureInput>>>;

/**
 * Modules that contribute to the figures. The figures service builds the base input from the
 * power system and parts, then merges each contribution over it in this order.
 */
export const FIGURE_CONTRIBUTORS: FigureInputContributor[] = [benchRunFigureInputs, readingFigureInputs];
