/** `npm run docs:options`: print the README options table generated from the option specs. */
import { renderOptionsTable } from './options.js';

process.stdout.write(renderOptionsTable());
