import { Redis } from 'ioredis';
import { FleetError } from './FleetError';

/** The queue's defaults: BullMQ's key prefix and the queue's name. */
export const DEFAULT_QUEUE_NAME = 'loopwise-fleet';
const PREFIX = 'bull';

/** The Redis key of the results hash of a queue: one field per task key, the file's result as JSON. */
export function resultsKey(queueName: string): string {
  return `${PREFIX}:${queueName}:loopwise-results`;
}

/** The key prefix BullMQ uses for the queue. */
export const QUEUE_PREFIX = PREFIX;

/** Milliseconds a connection attempt may take before the queue is called unreachable. */
const CONNECT_TIMEOUT_MS = 3000;

/**
 * Opens a connection to the Redis server at `address` (`redis://host:port[/db]`, or `rediss://`)
 * and checks it answers (PING) within a few seconds: one attempt, no endless retrying. An
 * unreachable or malformed address is a {@link FleetError} naming it (exit 2). The connection
 * returned is set as BullMQ needs it (`maxRetriesPerRequest: null`): it reconnects if the
 * server goes away later.
 */
export async function openQueueConnection(address: string, option = '--queue'): Promise<Redis> {
  let url: URL;
  try {
    url = new URL(address);
  } catch {
    throw new FleetError('invalid-queue', option, address, `${option} ${address}: not an address; expected redis://host:port`);
  }
  if (url.protocol !== 'redis:' && url.protocol !== 'rediss:') throw new FleetError('invalid-queue', option, address, `${option} ${address}: expected a redis:// or rediss:// address`);
  const probe = new Redis(address, { lazyConnect: true, connectTimeout: CONNECT_TIMEOUT_MS, maxRetriesPerRequest: 0, retryStrategy: () => null, enableOfflineQueue: false });
  let cause: Error | null = null;
  probe.on('error', (error: Error) => (cause ??= error)); // the socket's own error says most
  try {
    await probe.connect();
    await probe.ping();
  } catch (error) {
    probe.disconnect();
    throw new FleetError('unreachable-queue', option, address, `${option} ${address}: the queue cannot be reached (${(cause ?? (error as Error)).message})`);
  }
  probe.disconnect();
  const connection = new Redis(address, { maxRetriesPerRequest: null });
  connection.on('error', () => undefined); // ioredis reconnects; a lasting fault shows as no progress
  return connection;
}
