import { describe, expect, it } from 'vitest';
import {
  composeMailWording,
  statedDuration,
  unknownPlaceholders,
} from '../../../shared/mail/invitation-wording';

describe('statedDuration', () => {
  it.each([
    ['It takes about 10 minutes.', 'about 10 minutes'],
    ['This survey takes 12 to 15 minutes to complete.', '12 to 15 minutes'],
    ['Allow 5–8 min.', '5 to 8 minutes'],
    ['It takes 1 minute', 'about 1 minute'],
    ['Ten minutes of your time', null],
    ['We ask about 3 things.', null],
  ])('%s -> %s', (text, expected) => {
    expect(statedDuration(text)).toBe(expected);
  });
});

describe('placeholders', () => {
  it('finds unknown ones once each, and leaves known ones alone', () => {
    expect(unknownPlaceholders('{name} {x} {study} {x} {duration} {}')).toEqual(['x', '']);
  });

  it('fills every known placeholder; an empty name greets without one', () => {
    const w = composeMailWording({
      kind: 'invitation',
      name: '',
      study: 'Water',
      duration: null,
      subject: '{study} for {name}',
    });
    expect(w).toEqual({
      subject: 'Water for ',
      greeting: 'Hello,',
      message:
        'You are invited to take part in the survey "Water". Taking part is voluntary; the first page explains how your answers are used.',
    });
  });
});
