import { describe, expect, it } from 'vitest';
import { isGeneratedKey, questionKeyFromText } from '../../../shared/schemas/question-keys';
import { questionKeySchema } from '../../../shared/schemas/questionnaire';
import { createPage } from '../../../shared/schemas/questionnaire-defaults';
import { demoDefinition } from '../../../server/seed/demo-definition';

describe('questionKeyFromText', () => {
  it('makes a readable slug of the question text', () => {
    expect(questionKeyFromText('Do you filter your tap water before drinking it?')).toBe(
      'do_you_filter_your_tap_water_before',
    );
    expect(questionKeyFromText('What is your age?')).toBe('what_is_your_age');
  });

  it('writes accented and non-Latin letters as plain ASCII letters', () => {
    expect(questionKeyFromText('Größe des Haushalts')).toBe('groesse_des_haushalts');
    expect(questionKeyFromText('Âge du répondant')).toBe('age_du_repondant');
  });

  it('starts with a letter, even when the text starts with a number', () => {
    expect(questionKeyFromText('18 or older?')).toBe('q_18_or_older');
    expect(questionKeyFromText('?!')).toBe('question');
  });

  it('adds _2, _3 … until the key is unique', () => {
    expect(questionKeyFromText('What is your age?', ['what_is_your_age'])).toBe(
      'what_is_your_age_2',
    );
    expect(
      questionKeyFromText('What is your age?', ['what_is_your_age', 'what_is_your_age_2']),
    ).toBe('what_is_your_age_3');
  });

  it('always gives a valid export column name', () => {
    const texts = [
      'How many people live in your household, including you, counting children and lodgers?',
      'a',
      '   ',
      '日本語の質問',
      'Über 9000 Liter pro Jahr – ja oder nein?',
    ];
    for (const text of texts) {
      const key = questionKeyFromText(text, ['question']);
      expect(questionKeySchema.safeParse(key).success, `${text} → ${key}`).toBe(true);
    }
  });
});

describe('isGeneratedKey', () => {
  it('tells a key made from the text from one the researcher typed', () => {
    expect(isGeneratedKey('what_is_your_age', 'What is your age?', [])).toBe(true);
    expect(isGeneratedKey('age_band', 'What is your age?', [])).toBe(false);
  });
});

describe('createPage', () => {
  it('gives new questions readable keys that do not collide with the taken ones', () => {
    const first = createPage('question', demoDefinition);
    const second = createPage('question', demoDefinition, ['new_question']);
    const screening = createPage('screening', demoDefinition);
    expect(first.kind === 'question' && first.question.key).toBe('new_question');
    expect(second.kind === 'question' && second.question.key).toBe('new_question_2');
    expect(screening.kind === 'screening' && screening.question.key).toBe('are_you_18_or_older');
  });
});
