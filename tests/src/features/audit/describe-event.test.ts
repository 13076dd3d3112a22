import { describe, expect, it } from 'vitest';
import { describeAuditEvent } from '@/features/audit/utils/describe-event';
import type { AuditEvent } from '@shared/schemas/audit';

const event = (action: string, details: Record<string, unknown>): AuditEvent => ({
  id: 1,
  at: '2026-12-03T04:00:00.000Z',
  action,
  actorId: null,
  actorEmail: 'owner@example.test',
  studyId: null,
  targetType: 'respondent',
  targetId: null,
  details,
});

describe('describeAuditEvent: erasures', () => {
  it('names the respondent by number, the answers deleted and the reason', () => {
    expect(
      describeAuditEvent(
        event('respondent.erased', { number: 12, answers: 14, reason: 'Request DP-2026-014' }),
      ),
    ).toBe('Erased respondent #12 on request (14 answers deleted): Request DP-2026-014');
  });

  it('says "an invitation" when the person never opened their link', () => {
    expect(
      describeAuditEvent(event('respondent.erased', { number: null, answers: 0, reason: 'DP-7' })),
    ).toBe('Erased an invitation on request (0 answers deleted): DP-7');
  });
});
