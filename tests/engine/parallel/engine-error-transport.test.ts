/**
 * Engine errors cross a worker-thread boundary as plain values and come back as their own
 * classes, with the fields the job runner shows (line and column of bad data, the parameters
 * that are not identified).
 */
import { describe, expect, it } from 'vitest';
import { ChoiceDataError } from '../../../server/engine/estimation/choice-data';
import {
  EstimationFailedError,
  NonIdentifiedError,
} from '../../../server/engine/estimation/estimation-errors';
import {
  toTransportedError,
  unwrapWorkerResult,
} from '../../../server/engine/parallel/engine-error-transport';

/** What structured cloning does to a worker's return value. */
const acrossThreads = <T>(value: T): T => structuredClone(value);

describe('engine error transport', () => {
  it('brings a choice-data error back with its line and column', () => {
    const sent = acrossThreads(toTransportedError(new ChoiceDataError('not a number', 12, 'bill')));
    expect(() => unwrapWorkerResult(sent)).toThrowError(ChoiceDataError);
    try {
      unwrapWorkerResult(sent);
    } catch (err) {
      expect(err).toMatchObject({ message: 'not a number', line: 12, field: 'bill' });
    }
  });

  it('keeps non-identified parameters and failed-estimation messages', () => {
    const ni = acrossThreads(toTransportedError(new NonIdentifiedError('flat', ['asc', 'bill'])));
    expect(() => unwrapWorkerResult(ni)).toThrowError(NonIdentifiedError);
    const failed = acrossThreads(toTransportedError(new EstimationFailedError('a chain diverged')));
    expect(() => unwrapWorkerResult(failed)).toThrowError(
      new EstimationFailedError('a chain diverged'),
    );
  });

  it('rethrows errors it does not know, and passes results through', () => {
    expect(() => toTransportedError(new RangeError('bug'))).toThrowError(RangeError);
    expect(unwrapWorkerResult({ ok: true, result: 1 })).toEqual({ ok: true, result: 1 });
  });
});
