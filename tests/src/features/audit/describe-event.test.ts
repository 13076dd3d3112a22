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

describe('describeAuditEvent: languages', () => {
  it('names the languages added and removed', () => {
    expect(
      describeAuditEvent(
        event('study.languages_changed', {
          study: 'Water 2026',
          languages: ['en', 'fr'],
          added: ['fr'],
          removed: ['de'],
        }),
      ),
    ).toBe(
      'Changed the languages of study "Water 2026" to en, fr (added fr) (removed de; its texts deleted)',
    );
  });

  it('counts texts saved, imported and confirmed per language', () => {
    expect(
      describeAuditEvent(
        event('study.translations_saved', { study: 'W', language: 'de', saved: 3, removed: 1 }),
      ),
    ).toBe('Saved 3 de texts of study "W" and removed 1');
    expect(
      describeAuditEvent(
        event('study.translations_imported', {
          study: 'W',
          language: 'de',
          format: 'xliff',
          imported: 40,
          missing: 1,
          extra: 2,
        }),
      ),
    ).toBe(
      'Imported 40 de texts into study "W" from a file (XLIFF; 1 still missing, 2 unknown left out)',
    );
    expect(
      describeAuditEvent(
        event('study.translations_confirmed', { study: 'W', language: 'de', texts: 2 }),
      ),
    ).toBe('Confirmed 2 de texts of study "W" as still right after their source changed');
  });
});
