/**
 * What the kernel did with the benchmarked server's connections during a phase (Linux /proc):
 * - `listenOverflows`, `listenDrops`, `synRetransmits`: deltas of the TcpExt counters of
 *   /proc/net/netstat. They count for the whole network namespace, so other programs on a
 *   shared machine add to them; a connection attempt dropped because a listening socket's
 *   accept queue was full costs the phone a SYN retransmission (1 s, then 2 s more).
 * - `acceptQueueMax`: the longest accept queue of the server's own listening socket, sampled
 *   from /proc/net/tcp (for a listening socket its rx_queue column is the number of
 *   connections the kernel holds that the process has not accepted yet); this one is the
 *   server's alone.
 */
import fs from 'node:fs';

const COUNTERS = {
  listenOverflows: 'ListenOverflows',
  listenDrops: 'ListenDrops',
  synRetransmits: 'TCPSynRetrans',
} as const;
type Counters = Record<keyof typeof COUNTERS, number>;

/** The TcpExt counters, or null where /proc/net/netstat cannot be read or lacks one. */
export function readTcpExt(text?: string): Counters | null {
  let raw = text;
  try {
    raw ??= fs.readFileSync('/proc/net/netstat', 'utf8');
  } catch {
    return null;
  }
  const lines = raw.split('\n').filter((l) => l.startsWith('TcpExt:'));
  if (lines.length < 2) return null;
  const names = lines[0].trim().split(/\s+/);
  const values = lines[1].trim().split(/\s+/).map(Number);
  const out: Partial<Counters> = {};
  for (const [key, name] of Object.entries(COUNTERS)) {
    const i = names.indexOf(name);
    if (i < 0) return null;
    out[key as keyof Counters] = values[i];
  }
  return out as Counters;
}

/** Accept queue length of the socket listening on `port` (IPv4 or IPv6), or null if none is listed. */
export function acceptQueueOf(port: number, tables: string[]): number | null {
  const hexPort = port.toString(16).toUpperCase().padStart(4, '0');
  for (const table of tables) {
    for (const line of table.split('\n').slice(1)) {
      const f = line.trim().split(/\s+/);
      // local_address is HEXIP:HEXPORT, st 0A is LISTEN, tx_queue:rx_queue in hex.
      if (f.length < 5 || f[3] !== '0A' || !f[1].endsWith(`:${hexPort}`)) continue;
      return parseInt(f[4].split(':')[1], 16);
    }
  }
  return null;
}

function readTables(): string[] {
  return ['/proc/net/tcp', '/proc/net/tcp6'].flatMap((f) => {
    try {
      return [fs.readFileSync(f, 'utf8')];
    } catch {
      return [];
    }
  });
}

export type TcpPhase =
  (Counters & { acceptQueueMax: number | null; counterScope: string }) | { unavailable: string };

/** Starts counting for the server listening on `port`; stop() gives the phase's figures. */
export function measureTcp(port: number, sampleMs = 250) {
  const before = readTcpExt();
  let queueMax: number | null = null;
  const sample = () => {
    const q = acceptQueueOf(port, readTables());
    if (q !== null) queueMax = Math.max(queueMax ?? 0, q);
  };
  const timer = setInterval(sample, sampleMs);
  return {
    stop(): TcpPhase {
      clearInterval(timer);
      const after = readTcpExt();
      if (!before || !after) return { unavailable: 'no /proc/net/netstat TcpExt counters here' };
      return {
        listenOverflows: after.listenOverflows - before.listenOverflows,
        listenDrops: after.listenDrops - before.listenDrops,
        synRetransmits: after.synRetransmits - before.synRetransmits,
        acceptQueueMax: queueMax,
        counterScope: 'whole network namespace: other programs on the machine count too',
      };
    },
  };
}
