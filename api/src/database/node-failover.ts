import { connect } from 'node:net';

export interface DbNode {
  host: string;
  port: number;
}

/** `host:port,host:port` → nodes, in order. */
export function parseDbHosts(list: string): DbNode[] {
  return list.split(',').map((item) => {
    const at = item.lastIndexOf(':');
    return { host: item.slice(0, at), port: Number(item.slice(at + 1)) };
  });
}

/** True when the node accepts a TCP connection within `ms`. */
export function accepts(node: DbNode, ms = 1_000): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = connect({ host: node.host, port: node.port });
    const done = (ok: boolean) => {
      socket.destroy();
      resolve(ok);
    };
    socket.setTimeout(ms, () => done(false));
    socket.once('connect', () => done(true));
    socket.once('error', () => done(false));
  });
}

/**
 * Picks the node for a new connection: the first in the list that accepts one (the list
 * order is the preference: each replica lists its nearest node first). When none does, the
 * first is returned and the connection attempt reports the failure as usual (503).
 */
export async function pickNode(nodes: DbNode[]): Promise<DbNode> {
  for (const node of nodes) if (await accepts(node)) return node;
  return nodes[0];
}
