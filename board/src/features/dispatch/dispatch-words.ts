import type { DispatchLane, Priority } from '@baytime/shared';

export const PRIORITY_LABELS: Record<Priority, string> = {
  urgent: 'Urgent',
  high: 'High',
  normal: 'Normal',
  low: 'Low',
};

export const TECH_STATUS_LABELS: Record<DispatchLane['technician']['status'], string> = {
  'on-job': 'on a job',
  idle: 'idle',
  'on-break': 'on break',
  off: 'off shift',
};
