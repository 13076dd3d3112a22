import { describe, expect, it } from 'vitest';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';
import { demoQuestionnaire } from '../../../shared/schemas/questionnaire-defaults';
import {
  findMissingTexts,
  findStaleTranslations,
  listStudyTexts,
  localizeStudy,
} from '../../../shared/languages/study-texts';
import type { StudyDocuments } from '../../../shared/languages/study-text-keys';
import {
  canonicalLanguageTag,
  nativeLanguageName,
  textDirection,
} from '../../../shared/languages/language-tags';

function docs(): StudyDocuments {
  const definition = makeStudyDefinition();
  return {
    publicTitle: 'Water services 2026',
    definition,
    questionnaire: demoQuestionnaire(definition),
  };
}
const keysOf = (d: StudyDocuments) =>
  listStudyTexts(d, { languages: ['en'], translations: {} }).map((e) => e.key);

describe('study text keys', () => {
  it('are made of ids, so reordering pages, attributes and levels keeps every key', () => {
    const d = docs();
    const moved = docs();
    moved.definition.attributes.reverse();
    moved.definition.attributes.forEach((a) => a.levels.reverse());
    const [consent, ...rest] = moved.questionnaire.pages;
    const end = rest.pop()!;
    moved.questionnaire.pages = [consent, ...rest.reverse(), end];
    expect([...keysOf(moved)].sort()).toEqual([...keysOf(d)].sort());
    expect(new Set(keysOf(d)).size).toBe(keysOf(d).length);
  });

  it('cover the title, attributes, levels, the status quo, every page and the app’s own words', () => {
    const d = docs();
    const keys = keysOf(d);
    const bill = d.definition.attributes[0];
    expect(keys).toContain('study.title');
    expect(keys).toContain(`attribute.${bill.id}.name`);
    expect(keys).toContain(`level.${bill.id}.${bill.levels[0].id}`);
    expect(keys).toContain('fixed.label');
    for (const p of d.questionnaire.pages)
      expect(keys).toContain(
        p.kind === 'question' || p.kind === 'screening'
          ? `page.${p.id}.question`
          : `page.${p.id}.title`,
      );
    expect(keys).toContain('ui.screened_out_body');
  });
});

describe('localizeStudy', () => {
  it('writes a language into a copy, leaving the documents and the ids as they were', () => {
    const d = docs();
    const bill = d.definition.attributes[0];
    const consent = d.questionnaire.pages[0];
    const langs = {
      languages: ['en', 'de'],
      translations: {
        de: {
          'study.title': 'Wasserdienste 2026',
          [`attribute.${bill.id}.name`]: 'Monatliche Mehrkosten',
          [`level.${bill.id}.${bill.levels[1].id}`]: '3 €',
          [`page.${consent.id}.agree`]: 'Ich stimme zu',
          'ui.next': 'Weiter',
        },
      },
    };
    const { docs: de, ui } = localizeStudy(d, langs, 'de');
    expect(de.publicTitle).toBe('Wasserdienste 2026');
    expect(de.definition.attributes[0].name).toBe('Monatliche Mehrkosten');
    expect(de.definition.attributes[0].levels[1].label).toBe('3 €');
    expect(de.definition.attributes[0].levels[1].id).toBe(bill.levels[1].id);
    expect(de.questionnaire.pages[0]).toMatchObject({ agreeLabel: 'Ich stimme zu' });
    expect(ui['ui.next']).toBe('Weiter');
    // A text the draft still lacks falls back to the source wording.
    expect(ui['ui.back']).toBe('Back');
    expect(d.definition.attributes[0].name).not.toBe('Monatliche Mehrkosten');
  });

  it('in the source language gives back the documents’ texts', () => {
    const d = docs();
    const { docs: en } = localizeStudy(d, { languages: ['en'], translations: {} }, 'en');
    expect(en).toEqual(d);
  });
});

describe('findMissingTexts', () => {
  it('lists what a translation lacks, and nothing for the English source', () => {
    const d = docs();
    const langs = { languages: ['en', 'fr'], translations: { fr: { 'study.title': 'Eau' } } };
    const entries = listStudyTexts(d, langs);
    const missing = findMissingTexts(entries, langs);
    expect(missing.map((m) => m.language)).toEqual(['fr']);
    expect(missing[0].missing).toHaveLength(entries.length - 1);
  });

  it('asks a source language other than English for the app’s own words', () => {
    const d = docs();
    const langs = { languages: ['de'], translations: { de: { 'ui.next': 'Weiter' } } };
    const missing = findMissingTexts(listStudyTexts(d, langs), langs);
    const keys = missing[0].missing.map((e) => e.key);
    expect(keys.every((k) => k.startsWith('ui.'))).toBe(true);
    expect(keys).not.toContain('ui.next');
    expect(keys).toContain('ui.back');
  });
});

describe('language tags (BCP 47 through ECMA-402 Intl)', () => {
  it('canonicalises known languages and refuses the rest', () => {
    expect(canonicalLanguageTag('pt-br')).toBe('pt-BR');
    expect(canonicalLanguageTag('zh-hant-tw')).toBe('zh-Hant-TW');
    for (const bad of ['xx', 'en_US', 'x-foo', '', 'qaa'])
      expect(canonicalLanguageTag(bad)).toBe(null);
  });

  it('knows right-to-left languages by their script', () => {
    for (const rtl of ['ar', 'he', 'fa', 'ur', 'ar-EG', 'ku-Arab'])
      expect(textDirection(rtl)).toBe('rtl');
    for (const ltr of ['en', 'de', 'zh-Hant-TW', 'sr-Latn']) expect(textDirection(ltr)).toBe('ltr');
    expect(nativeLanguageName('de')).toBe('Deutsch');
  });
});

describe('stale translations', () => {
  it('are the translated texts whose source differs from the one recorded; unrecorded and empty ones are not', () => {
    const d = docs();
    const langs = {
      languages: ['en', 'de', 'fr'],
      translations: {
        de: { 'study.title': 'Wasser', 'ui.next': 'Weiter', 'ui.back': '' },
        fr: { 'study.title': 'Eau' },
      },
      sources: {
        de: { 'study.title': 'Water 2025', 'ui.next': 'Next', 'ui.back': 'Old back' },
      },
    };
    expect(findStaleTranslations(listStudyTexts(d, langs), langs)).toEqual({
      de: { 'study.title': 'Water 2025' },
      fr: {},
    });
  });
});
