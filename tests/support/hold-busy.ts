/**
 * The web process's side of the fieldwork flag in engine tests (server/lib/fieldwork-busy.ts
 * owns it in the product): a flag that is busy now and turns calm after `ms`, with a notify;
 * calmAt resolves with the time it turned calm.
 */
import { BUSY, CALM, createBusyFlag } from '../../server/engine/parallel/fieldwork-yield';

export function holdBusy(ms: number): { fieldworkBusy: Int32Array; calmAt: Promise<number> } {
  const fieldworkBusy = createBusyFlag();
  Atomics.store(fieldworkBusy, 0, BUSY);
  const calmAt = new Promise<number>((resolve) =>
    setTimeout(() => {
      Atomics.store(fieldworkBusy, 0, CALM);
      Atomics.notify(fieldworkBusy, 0);
      resolve(performance.now());
    }, ms),
  );
  return { fieldworkBusy, calmAt };
}
