import type { CreatePunchBody, PunchDto } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { apiWithToken } from '@/lib/api-client';
import { classifyFailure, type OutboxEntry, type OutboxPunch, type SendOutcome } from '../outbox';

/** `POST /api/punches` with the token of whoever tapped: 201 new, 200 the same id again. */
export function createPunch(body: CreatePunchBody, token: string): Promise<PunchDto> {
  return apiWithToken(token).post<PunchDto>('/punches', body);
}

/** `POST /api/kiosks/me/offline-punches` as this kiosk: 202 whether or not the PIN was right. */
function sendSealedPunch(
  { sealed, ...punch }: OutboxPunch & { sealed: { keyId: string; identity: string } },
  token: string,
) {
  return apiWithToken(token).post<{ id: string }>('/kiosks/me/offline-punches', { ...punch, ...sealed });
}

/** Sends one outbox entry and says what the outbox should do with it. */
export async function sendQueuedPunch(entry: OutboxEntry): Promise<SendOutcome> {
  const { sealed, ...punch } = entry.punch;
  try {
    if (sealed) await sendSealedPunch({ ...punch, sealed }, entry.token);
    else await createPunch(punch, entry.token);
    return { kind: 'sent' };
  } catch (error) {
    if (error instanceof ApiError) return classifyFailure(error.status, error.message);
    throw error;
  }
}
