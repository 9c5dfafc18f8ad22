import type { FindingAnswer, OfflinePunchStatus } from '@baytime/shared';

/**
 * Every cache key of the board app, in one place. A key that starts another is its prefix:
 * invalidating `findings.all()` refreshes every findings list. The live channel's table
 * (`live-queries.ts`) and the mutations name keys only through these.
 */
export const queryKeys = {
  me: () => ['me'] as const,
  shop: () => ['shop'] as const,
  bays: () => ['bays'] as const,
  users: () => ['users'] as const,
  operations: () => ['operations'] as const,
  dispatch: () => ['dispatch'] as const,
  vehicles: {
    all: () => ['vehicle'] as const,
    byVin: (vin: string) => ['vehicle', vin] as const,
  },
  customerApproval: (token: string) => ['customer-approval', token] as const,
  offlinePunches: {
    all: () => ['offline-punches'] as const,
    byStatus: (status: OfflinePunchStatus | null) => ['offline-punches', status] as const,
  },
  mailbox: {
    all: () => ['mailbox'] as const,
    message: (id: string) => ['mailbox', 'message', id] as const,
  },
  texts: () => ['textbox'] as const,
  findings: {
    all: () => ['findings'] as const,
    byAnswer: (answer: FindingAnswer) => ['findings', answer] as const,
    ofRepairOrder: (repairOrderId: number) => ['findings', { repairOrderId }] as const,
  },
  findingPhoto: (url: string) => ['finding-photo', url] as const,
  repairOrders: {
    all: () => ['repair-orders'] as const,
    /** `query` is the list's search string, made by `listQuery`. */
    page: (query: string) => ['repair-orders', 'page', query] as const,
  },
  repairOrder: {
    all: () => ['repair-order'] as const,
    one: (id: number) => ['repair-order', id] as const,
  },
  repairOrderHistory: {
    all: () => ['repair-order-history'] as const,
    one: (id: number) => ['repair-order-history', id] as const,
  },
  timecards: {
    all: () => ['timecards'] as const,
    ofTechnician: (technicianId: number) => ['timecards', technicianId] as const,
    week: (technicianId: number, week: string) => ['timecards', technicianId, week] as const,
  },
  openLines: () => ['timecard-open-lines'] as const,
  reports: {
    all: () => ['reports'] as const,
    labour: (week: string) => ['reports', 'labour', week] as const,
    pay: (week: string) => ['reports', 'pay', week] as const,
  },
  exceptions: {
    all: () => ['exceptions'] as const,
    week: (week: string) => ['exceptions', week] as const,
  },
  payRules: () => ['shop', 'pay-rules'] as const,
  integrationKeys: () => ['integration-keys'] as const,
  webhooks: () => ['webhooks'] as const,
  webhookDeliveries: {
    all: () => ['webhook-deliveries'] as const,
    page: (cursor: string | null) => ['webhook-deliveries', cursor] as const,
  },
  screens: (kind: 'wall' | 'kiosk') => [kind === 'wall' ? 'screens' : 'kiosks'] as const,
};

export const mutationKeys = {
  /** A dispatch move in flight: the live channel leaves the dispatch query alone until it settles. */
  moveLine: () => ['dispatch', 'move-line'] as const,
};
