/** The cautions every report carries (PDF footers, viewer.html footer). */
export const CAUTION =
  'Engineering measurement data, not a regulatory conformance or RF-exposure assessment. ' +
  'Defer to accredited test laboratories and the rules that apply locally.';
