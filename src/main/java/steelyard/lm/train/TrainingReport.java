package steelyard.lm.train;

import java.util.List;

/**
 * What training did, for the report on stderr or in JSON.
 *
 * @param smoothing      the method used
 * @param order          the model order
 * @param sentences      corpus lines used as sentences
 * @param emptyLines     lines that normalised to no token (not used as sentences; counted here)
 * @param tokens         tokens read, without sentence markers
 * @param unknownTokens  tokens mapped to {@code <unk>} by the vocabulary limits (or written as {@code <unk>})
 * @param vocabularySize token ids of the model, including {@code <s>}, {@code </s>} and {@code <unk>}
 * @param distinctNgrams distinct n-grams counted, per order (index 0 = unigrams), before the minimum counts
 * @param listedNgrams   n-grams listed in the model, per order, after the minimum counts (unigrams include an
 *                       unseen {@code <unk>})
 * @param discounts      per order, with their count-of-counts
 * @param warnings       invalid discounts replaced by defaults and other things the user should know
 * @param seconds        wall-clock time of counting and estimation
 */
public record TrainingReport(
    Smoothing smoothing, int order, long sentences, long emptyLines, long tokens, long unknownTokens,
    int vocabularySize, long[] distinctNgrams, long[] listedNgrams, List<Discounts> discounts,
    List<String> warnings, double seconds) {

  public TrainingReport {
    distinctNgrams = distinctNgrams.clone();
    listedNgrams = listedNgrams.clone();
    discounts = List.copyOf(discounts);
    warnings = List.copyOf(warnings);
  }

  @Override public long[] distinctNgrams() { return distinctNgrams.clone(); }
  @Override public long[] listedNgrams() { return listedNgrams.clone(); }
}
