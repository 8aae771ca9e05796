import { readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { randomInt } from 'node:crypto';

/** True when nothing listens on 127.0.0.1:port. */
export function isPortFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = createServer();
    server.once('error', () => resolve(false));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(true)));
  });
}

/** The first port the kernel hands out for outgoing connections (Linux: 32768 by default). */
function ephemeralLow(): number {
  try {
    const low = Number(readFileSync('/proc/sys/net/ipv4/ip_local_port_range', 'utf8').trim().split(/\s+/)[0]);
    return Number.isInteger(low) && low > 12000 ? low : 32768;
  } catch {
    return 32768;
  }
}

/**
 * A port that is free now and lies below the kernel's ephemeral range. A port the OS picks
 * with listen(0) comes from that range, so any outgoing connection in the meantime (a mail
 * retry to a fake that is down can even connect to itself) may take it before we listen
 * on it again, which showed as EADDRINUSE in CI. Ports below the range are only ever taken
 * by an explicit listen, so the window shrinks to two of our own processes drawing the
 * same one of ~20 000 numbers.
 */
export async function freePort(): Promise<number> {
  const high = ephemeralLow();
  const low = Math.max(10000, high - 20000);
  for (let attempt = 0; attempt < 200; attempt++) {
    const port = randomInt(low, high);
    if (await isPortFree(port)) return port;
  }
  throw new Error(`no free port found between ${low} and ${high}`);
}
