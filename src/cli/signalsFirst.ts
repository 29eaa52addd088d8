/**
 * Installs the interrupt handlers (signals.ts) as this module is evaluated. The bundled CLI's
 * entry (bundleEntry.ts) imports it first, so that the handlers are in place before the rest of
 * the bundle's modules run, as bin/spherecov.js does for the unbundled CLI.
 */
import { installSignalHandlers } from './signals.js';

installSignalHandlers();
