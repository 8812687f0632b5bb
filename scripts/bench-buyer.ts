import net from 'node:net';

export interface BuyerRequest {
  method: 'POST' | 'GET';
  path: string;
  body?: string;
  /** The status that counts as success. */
  expect: number;
}

export interface BuyerLoopResult {
  /** Rounds in which every request got its expected status. */
  rounds: number;
  /** Requests answered with another status, or lost with the connection. */
  failed: number;
}

const HEADER_END = Buffer.from('\r\n\r\n');

/**
 * One buyer on one kept-alive connection: sends its requests in turn, round after round, until the deadline, and reads
 * only what it needs of each answer (the status and, through Content-Length, where the answer ends). The requests are
 * built once as bytes with the buyer's cookie, so the load costs the two cores far less than a general HTTP client,
 * leaving them to the app and the fakes being measured. Answers must carry Content-Length (Express's JSON answers do).
 */
export async function buyerLoop(url: string, headers: Record<string, string>, requests: BuyerRequest[], untilMs: number): Promise<BuyerLoopResult> {
  const target = new URL(url);
  const raw = requests.map((r) => {
    const body = Buffer.from(r.body ?? '');
    const lines = [`${r.method} ${r.path} HTTP/1.1`, `host: ${target.host}`, 'connection: keep-alive', ...Object.entries(headers).map(([k, v]) => `${k}: ${v}`)];
    if (r.method !== 'GET') lines.push(`content-length: ${body.length}`);
    return Buffer.concat([Buffer.from(`${lines.join('\r\n')}\r\n\r\n`), body]);
  });
  const socket = net.connect(Number(target.port), target.hostname);
  socket.setNoDelay(true);
  await new Promise<void>((resolve, reject) => {
    socket.once('connect', resolve);
    socket.once('error', reject);
  });

  let rounds = 0;
  let failed = 0;
  let buffered: Buffer = Buffer.alloc(0);
  let waiting: ((status: number) => void) | null = null;
  let lost: ((error: Error) => void) | null = null;
  socket.on('data', (chunk: Buffer) => {
    buffered = buffered.length === 0 ? chunk : Buffer.concat([buffered, chunk]);
    const end = buffered.indexOf(HEADER_END);
    if (end < 0) return;
    const head = buffered.subarray(0, end).toString('latin1');
    const status = Number(head.slice(9, 12));
    const length = /\r\ncontent-length:\s*(\d+)/i.exec(head);
    if (!length) {
      lost?.(new Error(`an answer without Content-Length:\n${head}`));
      return;
    }
    const total = end + HEADER_END.length + Number(length[1]);
    if (buffered.length < total) return;
    buffered = buffered.subarray(total);
    const done = waiting;
    waiting = null;
    done?.(status);
  });
  const closed = new Promise<never>((_, reject) => {
    lost = reject;
    socket.once('error', reject);
    socket.once('close', () => reject(new Error('the app closed the connection')));
  });
  closed.catch(() => {});
  try {
    while (performance.now() < untilMs) {
      let ok = true;
      for (let i = 0; i < raw.length; i++) {
        const answered = new Promise<number>((resolve) => (waiting = resolve));
        socket.write(raw[i]!);
        const status = await Promise.race([answered, closed]);
        if (status !== requests[i]!.expect) {
          failed++;
          ok = false;
          break;
        }
      }
      if (ok) rounds++;
    }
  } catch {
    failed++;
  } finally {
    socket.destroy();
  }
  return { rounds, failed };
}
