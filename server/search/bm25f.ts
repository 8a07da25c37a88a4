/**
 * BM25F with a BM25+ floor. Each field's term frequency is length-normalised against that field's
 * average length and multiplied by the field's boost, and the products are summed BEFORE
 * saturation:
 *   tf~ = Σ_f boost_f · tf_f / (1 − b + b·len_f/avglen_f),
 *   score = idf · (δ + tf~·(k1 + 1) / (tf~ + k1)),
 *   idf = max(ε, ln((N − df + 0.5) / (df + 0.5))), df counting cases holding the term in any field
 *   (see `inverseDocumentFrequency`).
 * So a word repeated across the title, summary and story saturates once, as in one document,
 * instead of each short field earning a near-full score of its own; and a long story does not
 * discount a match in a title of usual length (one normalisation over the boost-weighted whole
 * case did: a case with a long narrative lost its title matches to shorter, looser cases).
 * source: Robertson & Zaragoza, "The Probabilistic Relevance Framework: BM25 and Beyond", FnTIR 3(4), 2009, 3.4 (BM25F);
 * Robertson, Zaragoza & Taylor, "Simple BM25 extension to multiple weighted fields", CIKM 2004 (combine before saturating);
 * δ: Lv & Zhai, "Lower-bounding term frequency normalization", CIKM 2011 (BM25+).
 * b = 0.75 for every field, the usual value (Robertson & Zaragoza 2009; SQLite FTS5's bm25()). k1 = 2, the
 * top of the 1.2–2 range usually found reasonable (Manning, Raghavan & Schütze, Introduction to Information
 * Retrieval, 2008, 11.4.3). The boosts put tf~ on a larger scale than a plain count (one title word is
 * about 4), where 1.2 is already near the ceiling: a word in the title, summary and tags scored little
 * more than the same word in a long story. Measured by bench/search-relevance.ts: nDCG@5 at 30k
 * 0.856 → 0.867, at 100k 0.853 → 0.856, the same at 10k. δ = 0.5 is minisearch 7's default.
 */
const K = 2;
const B = 0.75;
const D = 0.5;
/** The floor of idf: above it a word in over half the cases would count against a case that holds it. */
const IDF_FLOOR = 1e-6;

/**
 * The Robertson–Spärck Jones weight without relevance information, ln((N − df + 0.5) / (df + 0.5)),
 * floored at 1e-6 as SQLite FTS5's bm25() floors it. A word in more than half the cases ("probe",
 * "ringing" in a casebook about probing) says next to nothing about which case is meant, so only
 * its term frequency orders cases among themselves. The ln(1 + …) variant kept such words at about
 * ln 2 and let their repeats outweigh a rarer word the reader typed (a case repeating "clip lead …
 * ringing" ahead of the buck-converter case for "buck regulator ringing clip lead"). Measured by
 * bench/search-relevance.ts at 100k: nDCG@5 0.856 → 0.867; unchanged at 10k and 30k.
 * source: Robertson & Zaragoza, "The Probabilistic Relevance Framework: BM25 and Beyond", FnTIR 3(4), 2009, 3.3.
 */
export function inverseDocumentFrequency(caseCount: number, casesWithTerm: number): number {
  return Math.max(IDF_FLOOR, Math.log((caseCount - casesWithTerm + 0.5) / (casesWithTerm + 0.5)));
}

/** A field's length normalisation, 1 / (1 − b + b·len/avglen): its counts are multiplied by it. */
export const lengthNorm = (length: number, averageLength: number) => 1 / (1 - B + (B * length) / averageLength);

/** The saturated term frequency with the BM25+ floor, δ + tf~·(k1 + 1) / (tf~ + k1): times idf, a term's score. */
export const saturatedTf = (tf: number) => D + (tf * (K + 1)) / (tf + K);
