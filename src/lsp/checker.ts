import { existsSync } from 'node:fs';
import { Worker } from 'node:worker_threads';
import { checkSource, type CheckOptions, type FileReport } from '../engine/index.js';
import { WORKER_FILE, type Budget } from '../cli/pool.js';
import { receivedReport, type ReportMessage } from '../cli/transfer.js';

/** A check asked of the checker: one document's text as of one version. */
export interface CheckRequest {
  key: string;
  path: string;
  source: string;
  options: CheckOptions;
}

export type CheckOutcome = { report: FileReport } | { error: string; dropped?: boolean };

interface Slot {
  worker?: Worker;
  ready: boolean;
  busy?: { id: number; source: string; done: (o: CheckOutcome) => void; timer: NodeJS.Timeout };
}

/**
 * Checks documents off the message loop, on worker threads running the batch pool's worker
 * (src/cli/worker.ts) under the same per-document budget: a heap limit per worker and a time
 * limit per document, past which the worker is stopped, replaced, and the check dropped. With
 * two slots, one slow document leaves the other slot to the rest. Without the compiled worker
 * (run from sources) a check runs in this thread.
 */
export class Checker {
  private readonly slots: Slot[] = [];
  private readonly queue: Array<{ request: CheckRequest; done: (o: CheckOutcome) => void }> = [];
  private nextId = 0;
  private readonly workerFile = WORKER_FILE;
  private closed = false;

  constructor(
    private readonly budget: Budget,
    slots: number,
    private readonly log: (message: string) => void,
  ) {
    if (!existsSync(this.workerFile)) return;
    for (let i = 0; i < slots; i++) {
      const slot: Slot = { ready: false };
      this.slots.push(slot);
      this.start(slot);
    }
  }

  check(request: CheckRequest): Promise<CheckOutcome> {
    if (this.slots.length === 0) {
      try {
        return Promise.resolve({ report: checkSource(request.path, request.source, request.options) });
      } catch (e) {
        return Promise.resolve({ error: e instanceof Error ? e.message : String(e) });
      }
    }
    return new Promise((done) => {
      this.queue.push({ request, done });
      this.pump();
    });
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
    w.on('message', (m: { ready: true } | ReportMessage) => {
      if (slot.worker !== w) return;
      if ('ready' in m) {
        slot.ready = true;
        this.pump();
        return;
      }
      const busy = slot.busy;
      if (!busy || busy.id !== m.index) return;
      clearTimeout(busy.timer);
      slot.busy = undefined;
      // the worker does not send the text back: it is the one sent
      busy.done('error' in m ? { error: m.error } : { report: { ...receivedReport(m.bytes), source: busy.source } });
      this.pump();
    });
    w.on('error', (e: Error & { code?: string }) => {
      if (slot.worker !== w) return;
      const busy = slot.busy;
      slot.busy = undefined;
      void w.terminate();
      this.start(slot);
      if (!busy) return;
      clearTimeout(busy.timer);
      const why = e.code === 'ERR_WORKER_OUT_OF_MEMORY' ? `needed more than the memory budget of ${this.budget.memoryMb} MB` : `the check stopped: ${e.message}`;
      busy.done({ error: `not checked: ${why}`, dropped: true });
    });
  }

  private pump(): void {
    for (const slot of this.slots) {
      if (this.queue.length === 0) return;
      if (!slot.ready || slot.busy) continue;
      const { request, done } = this.queue.shift() as { request: CheckRequest; done: (o: CheckOutcome) => void };
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
      slot.worker?.postMessage({ index: id, path: request.path, source: request.source, options: request.options });
    }
  }
}
