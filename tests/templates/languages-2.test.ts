// The website and a tide book in German, Dutch and Norwegian (Bokmål): see languages.test.ts.
import { publishedIn } from './languages.js';

publishedIn(['de', 'nl', 'nb']);
