/**
 * Piscina worker entry of the latent class logit: validate the message, fit, return the result.
 * Progress (classes, start) goes into the shared control array, whose slot 0 asks it to stop.
 */
import type { ChoiceData } from '../estimation/choice-data';
import type { LatentClassOptions } from '../latent-class/check-latent-class-options';
import { fitLatentClass } from '../latent-class/fit-latent-class';
import { toTransportedError } from './engine-error-transport';
import { waitWhileBusy } from './fieldwork-yield';

export interface LatentClassWorkerMessage {
  data: ChoiceData;
  options: LatentClassOptions;
  /** [stop flag, classes being fitted, start number]. */
  control: Int32Array;
  /** The web process's busy flag: EM waits between its iterations while it is set. */
  busy?: Int32Array;
}

export async function handleLatentClassMessage(msg: LatentClassWorkerMessage): Promise<unknown> {
  if (
    !msg ||
    !(msg.data?.diffs instanceof Float64Array) ||
    !(msg.control instanceof Int32Array) ||
    (msg.busy !== undefined && !(msg.busy instanceof Int32Array))
  )
    throw new TypeError('invalid latent class worker message');
  const { control, busy } = msg;
  try {
    return await fitLatentClass(msg.data, msg.options, {
      onProgress: ({ classes, start }) => {
        Atomics.store(control, 1, classes);
        Atomics.store(control, 2, start);
      },
      shouldStop: () => {
        if (busy) waitWhileBusy(busy);
        return Atomics.load(control, 0) !== 0;
      },
    });
  } catch (err) {
    return toTransportedError(err);
  }
}
