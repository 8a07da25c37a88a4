/**
 * Function words that carry no meaning for finding a case. They sit at the top of any
 * English word-frequency list, so indexing them costs the longest posting lists for nothing.
 * Negations and units are kept on purpose ("no ringing", "not", "x").
 */
// common practice: our own short list, no source
export const STOPWORDS: ReadonlySet<string> = new Set(
  (
    'a an the and or but if then than so as of at by for from in into on onto to with without ' +
    'is are was were be been being am do does did doing has have had having it its it’s this that ' +
    'these those there here which who whom whose what when where while why how i me my we us our ' +
    'you your he him his she her they them their also just very too can could would should will ' +
    'shall may might must about over under again further once only own same such some any each ' +
    'few more most other all both up down out off our ours yours'
  ).split(/\s+/),
);
