import { useMutation } from '@tanstack/react-query';
import type { FigureDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';

/** The duty that holds a heater at a target surface temperature, worked out by the server (a read: nothing saved). */
export const dutyForTarget = ({ teardownId, loadId, target }: { teardownId: number; loadId: number; target: string }) =>
  api.get<{ figure: FigureDto }>(`/api/teardowns/${teardownId}/loads/${loadId}/duty-for-target?target=${encodeURIComponent(target)}`).then((r) => r.figure);

export const useDutyForTarget = () => useMutation({ mutationFn: dutyForTarget });
