/**
 * Which answers a closed study still takes: given before the close (arrival time minus the
 * age the phone reports), from a session that started before it, within the grace period.
 */
import { describe, expect, it } from 'vitest';
import { closeMoment, judgeLateAnswer } from '../../../server/services/late-answers';
import { fieldworkSettingsSchema } from '../../../shared/schemas/study-lifecycle';

const closedAt = new Date('2026-11-30T12:00:00Z');
const settings = fieldworkSettingsSchema.parse({
  closedReason: 'manual',
  closedAt: closedAt.toISOString(),
});
const at = (minutesAfterClose: number) => new Date(closedAt.getTime() + minutesAfterClose * 60_000);
const startedAt = at(-30);

describe('judgeLateAnswer', () => {
  it('accepts an answer given before the close that arrives hours later', () => {
    const now = at(6 * 60);
    const ageMs = now.getTime() - at(-1).getTime();
    expect(judgeLateAnswer({ status: 'closed', settings, startedAt, ageMs, now })).toBe('accept');
  });

  it('refuses an answer given after the close, and one without an age', () => {
    const now = at(10);
    expect(judgeLateAnswer({ status: 'closed', settings, startedAt, ageMs: 60_000, now })).toBe(
      'given_after_close',
    );
    expect(judgeLateAnswer({ status: 'closed', settings, startedAt, ageMs: undefined, now })).toBe(
      'given_after_close',
    );
  });

  it('refuses everything once the grace period (24 h by default) is over', () => {
    expect(settings.lateAnswerGraceHours).toBe(24);
    const now = at(24 * 60 + 1);
    const ageMs = now.getTime() - at(-1).getTime();
    expect(judgeLateAnswer({ status: 'closed', settings, startedAt, ageMs, now })).toBe(
      'grace_over',
    );
    const none = { ...settings, lateAnswerGraceHours: 0 };
    expect(
      judgeLateAnswer({ status: 'closed', settings: none, startedAt, ageMs: 120_000, now: at(1) }),
    ).toBe('grace_over');
  });

  it('refuses a session that started after the close, and studies that are not closed', () => {
    const now = at(5);
    expect(
      judgeLateAnswer({ status: 'closed', settings, startedAt: at(1), ageMs: 600_000, now }),
    ).toBe('given_after_close');
    expect(judgeLateAnswer({ status: 'draft', settings, startedAt, ageMs: 600_000, now })).toBe(
      'not_closed',
    );
  });
});

describe('closeMoment', () => {
  it('is the closing date for a scheduled close, even when the check ran later', () => {
    const s = fieldworkSettingsSchema.parse({
      closeAt: '2026-11-30T11:58:00Z',
      closedReason: 'date',
      closedAt: closedAt.toISOString(),
    });
    expect(closeMoment(s)?.toISOString()).toBe('2026-11-30T11:58:00.000Z');
    expect(closeMoment(settings)?.toISOString()).toBe(closedAt.toISOString());
    expect(closeMoment(fieldworkSettingsSchema.parse({}))).toBeNull();
  });
});
