import { describe, expect, it } from 'vitest';
import { createJobKinds } from '../../../server/jobs/background';
import { ESTIMATION_JOB } from '../../../server/services/runs';

describe('estimation job kind', () => {
  it('is registered with the queue, with a sweep and an expiry', () => {
    const kind = createJobKinds().find((k) => k.name === ESTIMATION_JOB);
    expect(kind).toBeDefined();
    expect(kind!.sweep).toBeTypeOf('function');
    expect(kind!.expireInMinutes).toBeGreaterThanOrEqual(60);
  });

  it('accepts a run id and refuses anything else', () => {
    const kind = createJobKinds().find((k) => k.name === ESTIMATION_JOB)!;
    const runId = '6f1c1a52-57a5-4a55-9f58-3f8c3d1f4a10';
    expect(kind.parse({ runId })).toEqual({ runId });
    expect(() => kind.parse({ runId: 'not-a-uuid' })).toThrow();
    expect(() => kind.parse({})).toThrow();
  });
});
