import type { RunState, SweepDetail, SweepEvent } from '../../../../shared/api';

/** A sweep as its event stream tells it: the snapshot, then each point and status change folded in. */
export function applySweepEvent(sweep: SweepDetail | null, event: SweepEvent): SweepDetail | null {
  switch (event.type) {
    case 'snapshot':
      return event.sweep;
    case 'point': {
      if (!sweep) return sweep;
      const points = sweep.points.slice();
      points[event.point.index] = event.point;
      return { ...sweep, points };
    }
    case 'status':
      return sweep ? { ...sweep, ...event.sweep, points: sweep.points } : sweep;
  }
}

export function isFinished(status: RunState): boolean {
  return status === 'solved' || status === 'failed' || status === 'cancelled';
}
