import { describe, expect, it } from "vitest";
import { type Delivery, LatestWinsScheduler, type PassKind } from "../../../app/analysis/scheduler";

/** A fake worker: each call waits until the test resolves it, so the test controls the interleaving. */
function fakeWorker() {
  const calls: {
    request: string;
    kind: PassKind;
    resolve: (v: string) => void;
    reject: (e: unknown) => void;
  }[] = [];
  const run = (request: string, kind: PassKind) =>
    new Promise<string>((resolve, reject) => {
      calls.push({ request, kind, resolve, reject });
    });
  return { calls, run };
}

const flush = () => new Promise((r) => setTimeout(r, 0));

function setup() {
  const worker = fakeWorker();
  const delivered: Delivery<string>[] = [];
  const scheduler = new LatestWinsScheduler<string, string>({
    run: worker.run,
    deliver: (d) => delivered.push(d),
    now: () => 0,
  });
  return { worker, delivered, scheduler };
}

describe("latest-wins analysis scheduling", () => {
  it("answers a discrete edit with a quick pass, then the full sweep of the same revision", async () => {
    const { worker, delivered, scheduler } = setup();
    scheduler.request(1, "plan@1", { interactive: false });
    expect(worker.calls.map((c) => c.kind)).toEqual(["quick"]);
    worker.calls[0].resolve("quick@1");
    await flush();
    expect(worker.calls.map((c) => `${c.kind}:${c.request}`)).toEqual(["quick:plan@1", "full:plan@1"]);
    worker.calls[1].resolve("full@1");
    await flush();
    expect(delivered.map((d) => (d.ok ? d.result : "error"))).toEqual(["quick@1", "full@1"]);
    expect(scheduler.isBusy).toBe(false);
  });

  it("drops the requests of a drag that were overtaken before they could start", async () => {
    const { worker, delivered, scheduler } = setup();
    scheduler.request(1, "plan@1", { interactive: true });
    // While revision 1 runs, the drag moves on three times: only the newest may run next.
    scheduler.request(2, "plan@2", { interactive: true });
    scheduler.request(3, "plan@3", { interactive: true });
    scheduler.request(4, "plan@4", { interactive: true });
    worker.calls[0].resolve("quick@1");
    await flush();
    expect(worker.calls.map((c) => c.request)).toEqual(["plan@1", "plan@4"]);
    // A drag asks for quick passes only.
    expect(worker.calls.every((c) => c.kind === "quick")).toBe(true);
    worker.calls[1].resolve("quick@4");
    await flush();
    expect(delivered.map((d) => d.revision)).toEqual([1, 4]);
    expect(worker.calls).toHaveLength(2);
  });

  it("follows the release of a drag with the full sweep", async () => {
    const { worker, scheduler } = setup();
    scheduler.request(1, "plan@1", { interactive: true });
    scheduler.request(1, "plan@1", { interactive: false }); // released at the same revision
    worker.calls[0].resolve("quick@1");
    await flush();
    // The quick pass already running for revision 1 is not repeated.
    expect(worker.calls.map((c) => `${c.kind}:${c.request}`)).toEqual(["quick:plan@1", "full:plan@1"]);
  });

  it("never lets a stale result overwrite a newer one, whatever order answers arrive in", async () => {
    // The worker is single-threaded, but a restarted worker or an out-of-order transport must still
    // be safe: deliveries are ranked by revision, then full over quick.
    const delivered: Delivery<string>[] = [];
    const pending: ((v: string) => void)[] = [];
    const scheduler = new LatestWinsScheduler<string, string>({
      run: (req) => new Promise<string>((r) => pending.push(() => r(req))),
      deliver: (d) => delivered.push(d),
      now: () => 0,
    });
    scheduler.request(5, "plan@5", { interactive: false });
    pending[0]("");
    await flush(); // quick@5 delivered, full@5 running
    scheduler.request(6, "plan@6", { interactive: false });
    pending[1]("");
    await flush(); // full@5: older than the requested 6, but newer than anything delivered
    pending[2]("");
    await flush(); // quick@6
    pending[3]("");
    await flush(); // full@6
    const order = delivered.map((d) => `${d.kind}@${d.revision}`);
    expect(order).toEqual(["quick@5", "full@5", "quick@6", "full@6"]);
    // Ranks only ever increase.
    const ranks = delivered.map((d) => d.revision * 2 + (d.kind === "full" ? 1 : 0));
    expect([...ranks].sort((a, b) => a - b)).toEqual(ranks);
  });

  it("ignores a request older than one already made", async () => {
    const { worker, scheduler } = setup();
    scheduler.request(3, "plan@3", { interactive: false });
    scheduler.request(2, "plan@2", { interactive: false });
    worker.calls[0].resolve("quick@3");
    await flush();
    expect(worker.calls.map((c) => c.request)).toEqual(["plan@3", "plan@3"]);
  });

  it("delivers a failure loudly and keeps serving later requests", async () => {
    const { worker, delivered, scheduler } = setup();
    scheduler.request(1, "bad", { interactive: true });
    worker.calls[0].reject(new Error("wire run 'w1': anchor above its support"));
    await flush();
    expect(delivered[0].ok).toBe(false);
    scheduler.request(2, "good", { interactive: true });
    worker.calls[1].resolve("quick@2");
    await flush();
    expect(delivered.map((d) => d.ok)).toEqual([false, true]);
  });

  it("drops a drag's quick result that was overtaken while it ran, if a newer one already arrived", async () => {
    const delivered: Delivery<string>[] = [];
    const scheduler = new LatestWinsScheduler<string, string>({
      run: (req, kind) => Promise.resolve(`${kind}:${req}`),
      deliver: (d) => delivered.push(d),
      now: () => 0,
    });
    scheduler.request(1, "a", { interactive: false });
    await flush();
    await flush();
    scheduler.request(2, "b", { interactive: false });
    await flush();
    await flush();
    expect(delivered.map((d) => (d.ok ? d.result : "")).slice(-1)).toEqual(["full:b"]);
    for (let i = 1; i < delivered.length; i++) {
      expect(delivered[i].revision).toBeGreaterThanOrEqual(delivered[i - 1].revision);
    }
  });
});

describe("latest-wins scheduling: no repeated work", () => {
  it("does not repeat a full pass already delivered for the same revision (a click that moved nothing)", async () => {
    const { worker, scheduler } = setup();
    scheduler.request(1, "plan@1", { interactive: false });
    worker.calls[0].resolve("q");
    await flush();
    worker.calls[1].resolve("f");
    await flush();
    scheduler.request(1, "plan@1", { interactive: false });
    await flush();
    expect(worker.calls).toHaveLength(2);
  });
});
