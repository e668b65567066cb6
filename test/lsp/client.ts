import { spawn, type ChildProcessWithoutNullStreams } from 'node:child_process';

/** A message as the Language Server Protocol's base protocol carries it (JSON-RPC 2.0). */
export interface Message {
  jsonrpc: '2.0';
  id?: number | string;
  method?: string;
  params?: unknown;
  result?: unknown;
  error?: { code: number; message: string };
}

/**
 * A tiny client for the base protocol, written from the specification (LSP 3.17, "Base
 * Protocol": a `Content-Length` header in bytes, `\r\n\r\n`, then the JSON body), so the test
 * does not speak through the library the server uses.
 */
export class TinyClient {
  readonly child: ChildProcessWithoutNullStreams;
  readonly received: Message[] = [];
  stderr = '';
  private buffer = Buffer.alloc(0);
  private nextId = 1;
  private readonly waiting = new Map<number | string, (m: Message) => void>();
  private readonly watchers: Array<{ test: (m: Message) => boolean; done: (m: Message) => void }> = [];
  /** Answers to requests from the server, by method. */
  readonly answers = new Map<string, (params: unknown) => unknown>();

  constructor(command: string, args: string[], cwd: string) {
    this.child = spawn(command, args, { cwd, stdio: 'pipe' });
    this.child.stderr.on('data', (d: Buffer) => (this.stderr += d.toString()));
    this.child.stdout.on('data', (d: Buffer) => this.read(d));
  }

  private read(d: Buffer): void {
    this.buffer = Buffer.concat([this.buffer, d]);
    for (;;) {
      const end = this.buffer.indexOf('\r\n\r\n');
      if (end < 0) return;
      const header = this.buffer.subarray(0, end).toString('ascii');
      const length = Number(/Content-Length: (\d+)/i.exec(header)?.[1]);
      if (this.buffer.length < end + 4 + length) return;
      const body = this.buffer.subarray(end + 4, end + 4 + length).toString('utf8');
      this.buffer = this.buffer.subarray(end + 4 + length);
      this.handle(JSON.parse(body) as Message);
    }
  }

  private handle(m: Message): void {
    this.received.push(m);
    if (m.method !== undefined && m.id !== undefined) {
      // a request from the server
      const answer = this.answers.get(m.method);
      this.write({ jsonrpc: '2.0', id: m.id, result: answer ? answer(m.params) : null });
      return;
    }
    if (m.id !== undefined && m.method === undefined) {
      this.waiting.get(m.id)?.(m);
      this.waiting.delete(m.id);
    }
    for (const w of [...this.watchers]) {
      if (w.test(m)) {
        this.watchers.splice(this.watchers.indexOf(w), 1);
        w.done(m);
      }
    }
  }

  private write(m: Message): void {
    const body = Buffer.from(JSON.stringify(m), 'utf8');
    this.child.stdin.write(Buffer.concat([Buffer.from(`Content-Length: ${body.length}\r\n\r\n`, 'ascii'), body]));
  }

  request(method: string, params: unknown): Promise<Message> {
    const id = this.nextId++;
    return new Promise((done) => {
      this.waiting.set(id, done);
      this.write({ jsonrpc: '2.0', id, method, params });
    });
  }

  notify(method: string, params: unknown): void {
    this.write({ jsonrpc: '2.0', method, params });
  }

  /** The next message (or one already received after `since`) that passes `test`. */
  waitFor(test: (m: Message) => boolean, since = 0): Promise<Message> {
    const seen = this.received.slice(since).find(test);
    if (seen) return Promise.resolve(seen);
    return new Promise((done) => this.watchers.push({ test, done }));
  }

  exited(): Promise<number | null> {
    if (this.child.exitCode !== null) return Promise.resolve(this.child.exitCode);
    return new Promise((done) => this.child.once('exit', (code) => done(code)));
  }
}
