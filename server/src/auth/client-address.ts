import ipaddr from 'ipaddr.js';

/**
 * The throttling key for a client's address. `::1`, `::ffff:127.0.0.1` and `127.0.0.1` are one
 * machine, and an IPv6 client counts as its /64, which one site usually holds whole.
 */
export function clientAddressKey(raw: string | undefined): string {
  if (!raw || !ipaddr.isValid(raw)) return 'unknown';
  const address = ipaddr.process(raw);
  if (address.kind() === 'ipv4') return address.toString();
  if (address.range() === 'loopback') return '127.0.0.1';
  const prefix = (address as ipaddr.IPv6).parts.slice(0, 4);
  return `${new ipaddr.IPv6([...prefix, 0, 0, 0, 0]).toString()}/64`;
}
