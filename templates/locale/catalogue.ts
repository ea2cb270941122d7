// Message catalogues: one per language, every key of the English one, words only (numbers, dates and
// months come from Intl through format.ts). A message is a string with {placeholders}, or a set of
// plural forms chosen by Intl.PluralRules on one numeric parameter named in `count`.
import { en } from './messages/en.js';
import { fr } from './messages/fr.js';
import { es } from './messages/es.js';
import { pt } from './messages/pt.js';
import { de } from './messages/de.js';
import { nl } from './messages/nl.js';
import { nb } from './messages/nb.js';

export type PluralMessage = { count: string; other: string } & Partial<Record<Intl.LDMLPluralRule, string>>;
export type Message = string | PluralMessage;
export type MessageKey = keyof typeof en;
export type Catalogue = Readonly<Record<MessageKey, Message>>;
export type Params = Readonly<Record<string, string | number>>;

/** The languages tidewright publishes in, by their BCP 47 language subtag. */
export const LANGUAGES = ['en', 'fr', 'es', 'pt', 'de', 'nl', 'nb'] as const;
export type Language = (typeof LANGUAGES)[number];

export const CATALOGUES: Readonly<Record<Language, Catalogue>> = { en, fr, es, pt, de, nl, nb };

/** The catalogue language of a BCP 47 tag ("fr-CA" → fr, "no" → nb), or null when unsupported. */
export function languageOf(tag: string): Language | null {
  let lang: string;
  try {
    lang = new Intl.Locale(tag).language;
  } catch {
    return null;
  }
  if (lang === 'no' || lang === 'nn') return 'nb'; // written Norwegian: the Bokmål catalogue
  return (LANGUAGES as readonly string[]).includes(lang) ? (lang as Language) : null;
}

const PLACEHOLDER = /\{(\w+)\}/;

/** A translator for one language: `t(key, params)` fills the placeholders; plural forms by Intl. */
export function translator(language: Language, numberText: (n: number) => string): (key: MessageKey, params?: Params) => string {
  const catalogue = CATALOGUES[language];
  const plural = new Intl.PluralRules(language);
  // each message split once at its placeholders: literal text at even places, placeholder names at odd
  const pieces = new Map<string, string[]>();
  return (key, params = {}) => {
    const message = catalogue[key] ?? en[key];
    let text: string;
    if (typeof message === 'string') text = message;
    else {
      const n = Number(params[message.count] ?? 0);
      text = message[plural.select(n)] ?? message.other;
    }
    if (!text.includes('{')) return text;
    let parts = pieces.get(text);
    if (!parts) {
      parts = text.split(PLACEHOLDER);
      pieces.set(text, parts);
    }
    let filled = parts[0] ?? '';
    for (let i = 1; i < parts.length; i += 2) {
      const name = parts[i] ?? '';
      const v = params[name];
      filled += (v === undefined ? `{${name}}` : typeof v === 'number' ? numberText(v) : v) + (parts[i + 1] ?? '');
    }
    return filled;
  };
}
