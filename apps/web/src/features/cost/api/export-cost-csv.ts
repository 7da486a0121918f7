import { buildUrl } from '@/lib/api-client';
import type { CostParams } from './get-cost';

/** Address of the costed-BOM CSV (the browser downloads it with the session cookie). */
export const costCsvUrl = (id: number, p: CostParams) => buildUrl(`/api/teardowns/${id}/cost.csv`, { volume: p.volume, currency: p.currency });
