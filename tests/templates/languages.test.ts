// Every language: the catalogue is complete; and (here for French, Spanish and Portuguese, in
// languages-2.test.ts for the others) the website and a tide book built in it carry no English word of
// the catalogue (station names and provenance aside), with the locale's own month and weekday names and
// decimal separator (Intl is the reference).
import { describe, expect, it } from 'vitest';
import { CATALOGUES, LANGUAGES } from '../../templates/locale/catalogue.js';
import { en } from '../../templates/locale/messages/en.js';
import { wordsFor } from '../../templates/locale/index.js';
import { demoPair, publishedIn } from './languages.js';
import { firstOf, itemAt } from '../../engine/index.js';

const placeholders = (text: string): string[] => [...text.matchAll(/\{(\w+)\}/g)].map((m) => itemAt(m, 1, 'm')).sort();

describe('message catalogues', () => {
  it.each(LANGUAGES)('%s has every key of the English catalogue, no empty text, the same placeholders', (language) => {
    const catalogue = CATALOGUES[language];
    expect(Object.keys(catalogue).sort()).toEqual(Object.keys(en).sort());
    for (const [key, english] of Object.entries(en)) {
      const message = catalogue[key as keyof typeof en];
      const forms = typeof message === 'string' ? [message] : Object.values(message).filter((v) => v !== message.count);
      for (const form of forms) expect(form.trim(), `${language} ${key}`).not.toBe('');
      const englishForms = typeof english === 'string' ? [english] : [english.other];
      const expected = placeholders(firstOf(englishForms, 'englishForms'));
      expect(placeholders(typeof message === 'string' ? message : message.other), `${language} ${key}`).toEqual(expected);
      if (typeof english !== 'string') {
        expect(typeof message, `${language} ${key} is a plural message`).toBe('object');
        if (typeof message !== 'string') expect(message.count).toBe(english.count);
      }
    }
  });

  it('chooses plural forms by Intl.PluralRules', () => {
    expect(wordsFor({ locale: 'en' }).duration(3600)).toBe('1 hour');
    expect(wordsFor({ locale: 'en' }).duration(7200 + 60)).toBe('2 hours 1 minute');
    expect(wordsFor({ locale: 'fr' }).duration(5400)).toBe('1 heure 30 minutes');
    expect(wordsFor({ locale: 'de' }).hours(45)).toBe('1 Tag 21 h');
    expect(wordsFor({ locale: 'de' }).hours(50)).toBe('2 Tage 2 h');
  });

  it('refuses a language without a catalogue in one line listing those there are', () => {
    expect(() => wordsFor({ locale: 'it' })).toThrow('"it" is not a language tidewright publishes in; write one of en, fr, es, pt, de, nl, nb');
    expect(wordsFor({ locale: 'pt-BR' }).language).toBe('pt');
    expect(wordsFor({ locale: 'no' }).language).toBe('nb');
  });

  it('describes a time zone for a reader, in the reader\u2019s language', () => {
    const [model] = demoPair();
    const days = model!.days;
    const lisbonLike = { days: days.map((d) => ({ ...d })) };
    expect(typeof wordsFor().zoneSummary(lisbonLike)).toBe('string');
    const fake = (offsetStart: string, changes: [string, string, string][]) => ({
      days: [{ ...firstOf(days, 'days'), offsetStart, offsetChange: null },
        ...changes.map(([date, from, to]) => ({ ...firstOf(days, 'days'), date, offsetChange: { time: `${date}T01:00:00Z`, from, to } }))],
    });
    const north = fake('+00:00', [['2027-03-28', '+00:00', '+01:00'], ['2027-10-31', '+01:00', '+00:00']]);
    expect(wordsFor({ locale: 'en' }).zoneSummary(north)).toBe('UTC+00:00; summer time UTC+01:00 from 28 March to 31 October');
    expect(wordsFor({ locale: 'fr' }).zoneSummary(north)).toBe('UTC+00:00 ; heure d’été UTC+01:00 du 28 mars au 31 octobre');
    const south = fake('+13:00', [['2027-04-04', '+13:00', '+12:00'], ['2027-09-26', '+12:00', '+13:00']]);
    expect(wordsFor({ locale: 'en' }).zoneSummary(south)).toBe('UTC+12:00; summer time UTC+13:00 until 4 April and from 26 September');
    expect(wordsFor({ locale: 'en' }).zoneSummary(fake('+05:30', []))).toBe('UTC+05:30 all year');
  });
});

publishedIn(['fr', 'es', 'pt']);
