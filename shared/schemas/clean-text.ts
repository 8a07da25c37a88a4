/**
 * Invisible characters that can hide or reorder what a reader sees (a title shown backwards by
 * U+202E, a name with an embedded bell or escape): C0 and C1 controls, DEL, the bidi marks,
 * embeddings, overrides and isolates, line and paragraph separators, the deprecated format
 * controls, the byte-order mark and the interlinear annotation marks.
 * Zero-width joiners (U+200C/U+200D) stay: scripts and emoji need them.
 * source: Unicode Standard Annex #9 (bidi controls, table 4); CVE-2021-42574 ("Trojan Source")
 */
const SINGLE_LINE = /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u2028\u2029\u202a-\u202e\u2066-\u206f\ufeff\ufff9-\ufffb]/g;
/** The same, but tab and line feed stay in text that may span lines. */
const MULTI_LINE = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u061c\u200e\u200f\u2028\u2029\u202a-\u202e\u2066-\u206f\ufeff\ufff9-\ufffb]/g;

/** A single-line field (title, name, tag) without control or bidi-override characters. */
export function stripControlChars(value: string): string {
  return value.replace(SINGLE_LINE, '');
}

/** A multi-line field keeps tabs and newlines (CRLF becomes LF) and loses every other control. */
export function stripControlCharsMultiline(value: string): string {
  return value.replace(/\r\n?/g, '\n').replace(MULTI_LINE, '');
}
