/**
 * Gathers work items that arrive while earlier work is in flight into batches, so that one
 * round trip serves many of them (the answer path's multi-row statement, a panel launch's
 * hottest write). Items submitted during one turn of the event loop leave together at the end
 * of that turn (setImmediate: after the loop has read every request that was ready), when
 * fewer than `maxInFlight` batches are running, so a quiet server adds no wait beyond the
 * turn; under load, the items that queued behind the running batches leave together in the
 * next one, at most `maxBatch` of them.
 *
 * A batch holds at most one item per key, in arrival order, and no key of a batch still in
 * flight: a second item with the same key (a respondent's next answer, or the same answer sent
 * again) waits until the first is done, so items of one key run one after the other, as they
 * would without batching, and two batches in flight never wait on each other's rows.
 *
 * `runBatch` gets two or more items and returns one result per item, in order; a batch of one
 * goes to `runOne`. When a batch fails as a whole, every item of it is run again on its own
 * (`runOne`), so that each gets its own result or its own error: one item's failure never
 * decides the others'.
 */
export type KeyedBatcher<I, O> = {
  submit(item: I): Promise<O>;
  /** Items waiting for a batch, batches in flight, items sent so far in batches of two or more. */
  readonly waiting: number;
  readonly inFlight: number;
  readonly gathered: number;
};

type Entry<I, O> = { item: I; key: string; resolve: (o: O) => void; reject: (e: unknown) => void };

export type KeyedBatcherOptions<I, O> = {
  keyOf: (item: I) => string;
  runOne: (item: I) => Promise<O>;
  runBatch: (items: I[]) => Promise<O[]>;
  maxBatch: number;
  maxInFlight: number;
};

export function createKeyedBatcher<I, O>(opts: KeyedBatcherOptions<I, O>): KeyedBatcher<I, O> {
  let queue: Entry<I, O>[] = [];
  let inFlight = 0;
  let gathered = 0;
  /** Keys of the batches in flight. */
  const busy = new Set<string>();

  /**
   * The next batch: the oldest items, one per key and none of a key in flight, up to
   * maxBatch; the rest keep their order. Empty when every waiting item's key is in flight.
   */
  function takeBatch(): Entry<I, O>[] {
    const batch: Entry<I, O>[] = [];
    const rest: Entry<I, O>[] = [];
    for (const e of queue) {
      if (batch.length < opts.maxBatch && !busy.has(e.key)) {
        busy.add(e.key);
        batch.push(e);
      } else rest.push(e);
    }
    queue = rest;
    return batch;
  }

  async function run(batch: Entry<I, O>[]): Promise<void> {
    if (batch.length === 1) {
      await settle(batch[0], () => opts.runOne(batch[0].item));
      return;
    }
    let results: O[];
    try {
      results = await opts.runBatch(batch.map((e) => e.item));
      if (results.length !== batch.length)
        throw new Error(`a batch of ${batch.length} gave ${results.length} results`);
    } catch {
      // Each on its own: its own result, or its own error.
      await Promise.all(batch.map((e) => settle(e, () => opts.runOne(e.item))));
      return;
    }
    batch.forEach((e, i) => e.resolve(results[i]));
  }

  async function settle(e: Entry<I, O>, work: () => Promise<O>): Promise<void> {
    try {
      e.resolve(await work());
    } catch (err) {
      e.reject(err);
    }
  }

  function pump(): void {
    while (inFlight < opts.maxInFlight && queue.length > 0) {
      const batch = takeBatch();
      if (batch.length === 0) return; // the keys waiting are in flight: their batch ends first
      inFlight++;
      if (batch.length > 1) gathered += batch.length;
      void run(batch).finally(() => {
        for (const e of batch) busy.delete(e.key);
        inFlight--;
        pump();
      });
    }
  }

  let pumpScheduled = false;
  const pumpAtTurnEnd = () => {
    pumpScheduled = false;
    pump();
  };

  return {
    submit(item) {
      return new Promise<O>((resolve, reject) => {
        queue.push({ item, key: opts.keyOf(item), resolve, reject });
        if (!pumpScheduled) {
          pumpScheduled = true;
          setImmediate(pumpAtTurnEnd);
        }
      });
    },
    get waiting() {
      return queue.length;
    },
    get inFlight() {
      return inFlight;
    },
    get gathered() {
      return gathered;
    },
  };
}

/**
 * One batcher per owner (a database pool: batches never mix two pools), made on first use and
 * forgotten with its owner.
 */
export function keyedBatcherPer<P extends object, I, O>(
  optionsFor: (owner: P) => KeyedBatcherOptions<I, O>,
): (owner: P) => KeyedBatcher<I, O> {
  const made = new WeakMap<P, KeyedBatcher<I, O>>();
  return (owner) => {
    let batcher = made.get(owner);
    if (!batcher) {
      batcher = createKeyedBatcher(optionsFor(owner));
      made.set(owner, batcher);
    }
    return batcher;
  };
}
