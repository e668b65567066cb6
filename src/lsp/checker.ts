import { existsSync } from 'node:fs';
import { Worker } from 'node:worker_threads';
import { IncrementalChecker, type CheckOptions, type FileReport } from '../engine/index.js';
import { WORKER_FILE, type Budget } from '../cli/pool.js';
import { receivedReport, type ReportMessage } from '../cli/transfer.js';

/** A check asked of the checker: one document's text as of one version. */
export interface CheckRequest {
  key: string;
  path: string;
  source: string;
  options: CheckOptions;
}

/** Starts in a row a slot tries after a worker of it has loaded once, before it is given up. */
const START_TRIES = 3;

export type CheckOutcome = { report: FileReport } | { error: string; dropped?: boolean };

interface Slot {
  worker?: Worker;
  ready: boolean;
  /** A worker of this slot has loaded once: its script works, so a start that fails is retried (START_TRIES). */
  loaded?: boolean;
  /** Starts that failed in a row since a worker of this slot last loaded. */
  failedStarts?: number;
  /** Documents whose last check ran here: their last parse is kept in this worker. */
  keys: Set<string>;
  busy?: { id: number; source: string; done: (o: CheckOutcome) => void; timer: NodeJS.Timeout };
}

/**
 * Checks documents off the message loop, on worker threads running the batch pool's worker
 * (src/cli/worker.ts) under the same per-document budget: a heap limit per worker and a time
 * limit per document, past which the worker is stopped, replaced, and the check dropped. With
 * two slots, one slow document leaves the other slot to the rest. Without the compiled worker
 * (run from sources) a check runs in this thread. Each document's checks go to the worker that
 * checked it last when it is free, which keeps its last parse and re-reads only what an edit
 * changed (IncrementalChecker); any worker gives the same result.
 */
export class Checker {
  private readonly slots: Slot[] = [];
  private readonly queue: Array<{ request: CheckRequest; done: (o: CheckOutcome) => void }> = [];
  /** Without workers: each document's incremental checker, in this thread. */
  private readonly local = new Map<string, IncrementalChecker>();
  private nextId = 0;
  private closed = false;

  constructor(
    private readonly budget: Budget,
    slots: number,
    private readonly log: (message: string) => void,
    /** The worker's script: the compiled one beside the pool (tests pass their own). */
    private readonly workerFile: string = WORKER_FILE,
  ) {
    if (!existsSync(this.workerFile)) return;
    for (let i = 0; i < slots; i++) {
      const slot: Slot = { ready: false, keys: new Set() };
      this.slots.push(slot);
      this.start(slot);
    }
  }

  check(request: CheckRequest): Promise<CheckOutcome> {
    if (this.slots.length === 0) return Promise.resolve(this.checkHere(request));
    return new Promise((done) => {
      this.queue.push({ request, done });
      this.pump();
    });
  }

  /** A check in this thread, keeping the document's last parse here. */
  private checkHere(request: CheckRequest): CheckOutcome {
    try {
      let checker = this.local.get(request.key);
      if (!checker) {
        checker = new IncrementalChecker();
        this.local.set(request.key, checker);
      }
      return { report: checker.check(request.path, request.source, request.options) };
    } catch (e) {
      return { error: e instanceof Error ? e.message : String(e) };
    }
  }

  /** A document was closed: its last parse is dropped. */
  forget(key: string): void {
    this.local.delete(key);
    for (const slot of this.slots) {
      if (!slot.keys.delete(key)) continue;
      slot.worker?.postMessage({ forget: key });
    }
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const s of this.slots) if (s.busy) clearTimeout(s.busy.timer);
    await Promise.all(this.slots.map((s) => s.worker?.terminate()));
  }

  private start(slot: Slot): void {
    if (this.closed) return;
    const w = new Worker(this.workerFile, { resourceLimits: { maxOldGenerationSizeMb: this.budget.memoryMb, maxYoungGenerationSizeMb: 64 } });
    slot.worker = w;
    slot.ready = false;
    slot.keys.clear();
    w.on('message', (m: { ready: true } | ReportMessage) => {
      if (slot.worker !== w) return;
      if ('ready' in m) {
        slot.ready = true;
        slot.loaded = true;
        slot.failedStarts = 0;
        this.pump();
        return;
      }
      const busy = slot.busy;
      if (!busy || busy.id !== m.index) return;
      clearTimeout(busy.timer);
      slot.busy = undefined;
      // the worker does not send the text back: it is the one sent
      busy.done('error' in m ? { error: m.error } : { report: { ...receivedReport(m.parts), source: busy.source } });
      this.pump();
    });
    w.on('error', (e: Error & { code?: string }) => {
      if (slot.worker !== w || this.closed) return;
      if (e.code === 'ERR_WORKER_OUT_OF_MEMORY') this.lost(slot, w, `needed more than the memory budget of ${this.budget.memoryMb} MB`, 'it ran out of memory');
      else this.lost(slot, w, `the check stopped: ${e.message}`, e.message);
    });
    // a worker that ends without an error would otherwise be sent checks it never answers
    w.on('exit', (code: number) => {
      if (slot.worker !== w || this.closed) return;
      this.lost(slot, w, `the check stopped: its worker thread exited (exit code ${code})`, `it exited with code ${code}`);
    });
  }

  /**
   * The slot's worker stopped (`why` for the check it drops, `cause` for the log). After it had
   * loaded, it is replaced and the check it was running, if any, is dropped with the reason.
   * Before it had loaded: when no worker of the slot ever loaded, a new one would fail the same
   * way (the fault is the worker's script); otherwise it is tried again, up to START_TRIES starts
   * in a row. A slot that cannot start a worker is given up, and when none is left the checks run
   * in this thread, as without the compiled worker.
   */
  private lost(slot: Slot, w: Worker, why: string, cause: string): void {
    const busy = slot.busy;
    slot.busy = undefined;
    void w.terminate();
    if (busy) {
      clearTimeout(busy.timer);
      busy.done({ error: `not checked: ${why}`, dropped: true });
    }
    if (slot.ready) {
      this.start(slot);
      return;
    }
    // a replacement that failed while loading, in a slot whose workers have loaded before (a
    // thread that could not start for the moment): tried again, a few times in a row at most
    slot.failedStarts = (slot.failedStarts ?? 0) + 1;
    if (slot.loaded === true && slot.failedStarts < START_TRIES) {
      this.start(slot);
      return;
    }
    slot.worker = undefined;
    this.slots.splice(this.slots.indexOf(slot), 1);
    this.log(`plumbline: a worker thread could not start: ${cause}${this.slots.length === 0 ? '; checks run in this thread' : ''}`);
    if (this.slots.length > 0) return;
    for (const { request, done } of this.queue.splice(0)) done(this.checkHere(request));
  }

  private pump(): void {
    for (const slot of this.slots) {
      if (this.queue.length === 0) return;
      if (!slot.ready || slot.busy) continue;
      // a waiting document this worker checked last, else the first waiting whose worker is busy
      // or gone, else the first waiting
      const free = (s: Slot) => s.ready && !s.busy;
      let at = this.queue.findIndex((q) => slot.keys.has(q.request.key));
      if (at < 0) at = this.queue.findIndex((q) => !this.slots.some((s) => s !== slot && s.keys.has(q.request.key) && free(s)));
      if (at < 0) at = 0;
      const { request, done } = this.queue.splice(at, 1)[0] as { request: CheckRequest; done: (o: CheckOutcome) => void };
      for (const s of this.slots) if (s !== slot && s.keys.delete(request.key)) s.worker?.postMessage({ forget: request.key });
      slot.keys.add(request.key);
      const id = this.nextId++;
      const timer = setTimeout(() => {
        if (slot.busy?.id !== id) return;
        slot.busy = undefined;
        const old = slot.worker;
        this.start(slot);
        void old?.terminate();
        this.log(`plumbline: dropped the check of ${request.path}: it took longer than the time budget of ${this.budget.seconds} s`);
        done({ error: `not checked: took longer than the time budget of ${this.budget.seconds} s`, dropped: true });
      }, this.budget.seconds * 1000);
      slot.busy = { id, source: request.source, done, timer };
      slot.worker?.postMessage({ index: id, path: request.path, source: request.source, options: request.options, session: request.key });
    }
  }
}
