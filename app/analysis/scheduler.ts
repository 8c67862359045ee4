/**
 * Latest-wins scheduling of analyses on one worker.
 *
 * The worker runs one job at a time and cannot be interrupted, so "dropping stale requests" means:
 * never queue more than the newest job of each kind, never start a job older than the newest request,
 * and never deliver a result older than one already delivered. While a support is dragged only quick
 * passes are asked for; on release (or any discrete edit) a quick pass answers first and the full band
 * sweep follows for the same revision.
 *
 * Pure logic over an injected `run` function, so it is unit-tested with a fake worker.
 */
export type PassKind = "quick" | "full";

export interface Job<Req> {
  revision: number;
  kind: PassKind;
  request: Req;
}

export type Delivery<Res> =
  | { revision: number; kind: PassKind; ok: true; result: Res; elapsedMs: number }
  | { revision: number; kind: PassKind; ok: false; error: unknown; elapsedMs: number };

export interface SchedulerHooks<Req, Res> {
  /** Run one job on the worker. */
  run: (request: Req, kind: PassKind) => Promise<Res>;
  /** A result (or failure) that is newer than anything delivered before. */
  deliver: (delivery: Delivery<Res>) => void;
  /** A job starts or the queue drains: lets the UI say "computing". */
  onBusy?: (busy: boolean, running: Job<Req> | null) => void;
  now?: () => number;
}

/** Rank of a delivery: a newer revision beats an older one; at one revision the full pass beats quick. */
function rank(revision: number, kind: PassKind): number {
  return revision * 2 + (kind === "full" ? 1 : 0);
}

export class LatestWinsScheduler<Req, Res> {
  private pendingQuick: Job<Req> | null = null;
  private pendingFull: Job<Req> | null = null;
  private running: Job<Req> | null = null;
  private latestRevision = -1;
  private deliveredRank = -1;
  private disposed = false;

  constructor(private readonly hooks: SchedulerHooks<Req, Res>) {}

  /**
   * Ask for an analysis of document `revision`. `interactive` (a drag in progress) asks for the quick
   * pass only; otherwise quick then full. Older pending jobs are dropped.
   */
  request(revision: number, request: Req, options: { interactive: boolean }): void {
    if (this.disposed) return;
    if (revision < this.latestRevision) return;
    this.latestRevision = revision;
    const covered = (kind: PassKind) =>
      (this.running?.revision === revision && this.running.kind === kind) ||
      this.deliveredRank >= rank(revision, kind);
    this.pendingQuick = covered("quick") ? null : { revision, kind: "quick", request };
    this.pendingFull = options.interactive || covered("full") ? null : { revision, kind: "full", request };
    this.pump();
  }

  /** The newest revision asked for (what a displayed result must match to be current). */
  get newestRevision(): number {
    return this.latestRevision;
  }

  get isBusy(): boolean {
    return this.running !== null || this.pendingQuick !== null || this.pendingFull !== null;
  }

  dispose(): void {
    this.disposed = true;
    this.pendingQuick = null;
    this.pendingFull = null;
  }

  private next(): Job<Req> | null {
    // Quick first: it answers in a frame or two; the full sweep follows.
    for (const slot of ["pendingQuick", "pendingFull"] as const) {
      const job = this[slot];
      this[slot] = null;
      if (job && job.revision >= this.latestRevision) return job;
    }
    return null;
  }

  private pump(): void {
    if (this.running || this.disposed) return;
    const job = this.next();
    if (!job) {
      this.hooks.onBusy?.(false, null);
      return;
    }
    this.running = job;
    this.hooks.onBusy?.(true, job);
    const now = this.hooks.now ?? (() => performance.now());
    const started = now();
    const finish = (delivery: Delivery<Res>) => {
      this.running = null;
      if (!this.disposed && rank(job.revision, job.kind) > this.deliveredRank) {
        this.deliveredRank = rank(job.revision, job.kind);
        this.hooks.deliver(delivery);
      }
      this.pump();
    };
    this.hooks.run(job.request, job.kind).then(
      (result) =>
        finish({ revision: job.revision, kind: job.kind, ok: true, result, elapsedMs: now() - started }),
      (error: unknown) =>
        finish({ revision: job.revision, kind: job.kind, ok: false, error, elapsedMs: now() - started }),
    );
  }
}
