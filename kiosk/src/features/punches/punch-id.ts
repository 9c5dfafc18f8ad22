/**
 * A v4 UUID for a punch. `crypto.randomUUID` exists only in secure contexts (HTTPS or localhost);
 * a tablet on the shop's Wi-Fi often reaches the server over plain HTTP, where only
 * `crypto.getRandomValues` is available.
 */
export function newPunchId(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  bytes[6] = (bytes[6]! & 0x0f) | 0x40;
  bytes[8] = (bytes[8]! & 0x3f) | 0x80;
  const hex = Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}
